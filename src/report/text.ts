/**
 * Manuscript text made safe for a terminal: C0/C1 control characters (escape sequences
 * among them) become a visible "?" so a hostile file cannot move the cursor, recolour or
 * retitle the terminal.
 */
export function terminalSafe(s: string): string {
  return s.replace(/[\u0000-\u0008\u000B-\u001F\u007F-\u009F]/g, '?');
}
