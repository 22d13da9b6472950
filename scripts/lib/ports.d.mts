// Types for ports.mjs, so the TypeScript tests can check how `npm start` chooses its ports.
export interface PortEntry { variable: string; fallback: number; what: string }
export function isFree(port: number, host?: string): Promise<boolean>;
export function choosePorts(entries: PortEntry[], env?: Record<string, string | undefined>, host?: string): Promise<Record<string, number>>;
