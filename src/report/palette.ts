/**
 * nestready's own colours for HTML and charts. Text colours keep a contrast of at least 4.5:1
 * on the paper and panel colours (WCAG AA); severity always has a word and a mark beside it.
 */
export const PALETTE = {
  ink: '#1d2a31',
  muted: '#4f5f67',
  line: '#d3dcdf',
  grid: '#e8eef0',
  paper: '#f6f4ef',
  panel: '#ffffff',
  accent: '#2f5d62',
  accentSoft: '#9cbcbf',
  highlight: '#c05a1a',
  blocker: '#b0174f',
  blockerSoft: '#fbe9ef',
  warning: '#8a5200',
  warningSoft: '#fdf1dc',
  note: '#1e6096',
  noteSoft: '#e6f0f8',
  ok: '#2a6f2e',
  okSoft: '#e7f3e8',
} as const;
