// Types of heapCap.js (plain JavaScript: bin/bandatlas.js reads it before the TypeScript loader starts).
export const buildHeapCapMb: number;
export const cappedCommands: string[];
export function heapCapArgs(execArgv: readonly string[], nodeOptions?: string): string[];
