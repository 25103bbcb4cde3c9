import type { Row } from './delivery.js';

// A: one group, 5 records under north and 1 under south, same size → split
// B: 3 records under north with size 10, 3 under south with size 20 → one code reused by two parents
// C: under one parent → fine
/** Shared by the group-in-several-parents and group-code-reused tests. */
export const parentRows: Row[] = [
  ...[1, 2, 3, 4, 5].map((i) => ({ g: 'A', p: 'north', size: 8, y: i })),
  { g: 'A', p: 'south', size: 8, y: 6 },
  ...[1, 2, 3].map((i) => ({ g: 'B', p: 'north', size: 10, y: i })),
  ...[1, 2, 3].map((i) => ({ g: 'B', p: 'south', size: 20, y: i })),
  ...[1, 2, 3].map((i) => ({ g: 'C', p: 'east', size: 5, y: i })),
];
