/** How the weaver arranged the workspace (divider, folded side column), kept on this device only. */
const KEY = 'shedwright.workspace.';

export function readLayoutSetting(name: string): string | null {
  try {
    return typeof localStorage === 'undefined' ? null : localStorage.getItem(KEY + name);
  } catch {
    return null;
  }
}

export function writeLayoutSetting(name: string, value: string): void {
  try {
    if (typeof localStorage !== 'undefined') localStorage.setItem(KEY + name, value);
  } catch {
    // A full or blocked storage only loses the arrangement, never work.
  }
}
