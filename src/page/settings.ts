/**
 * What `nestready page` bakes into the page (a JSON script element in index.html): the data
 * manager's role map as written (parsed in the page, so that its errors read as the CLI's), the
 * preset and the version that built it.
 */
export interface PageSettings {
  tool: { name: string; version: string };
  roles: { file: string; text: string };
  preset?: string;
}

/** The id of the script element that holds the settings. */
export const SETTINGS_ID = 'nr-settings';

/** The settings as a script element's text: `<` written as \u003c so no text in them can close the element. */
export function settingsScript(settings: PageSettings): string {
  return JSON.stringify(settings).replace(/</g, '\\u003c');
}
