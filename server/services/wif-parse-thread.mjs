// The entry of the thread that reads large WIF files (services/wif-parse.ts starts it). Plain
// JavaScript, because a thread does not inherit the loader that lets the server run TypeScript:
// it loads the TypeScript part itself.
import { tsImport } from 'tsx/esm/api';

await tsImport('./wif-parse-worker.ts', import.meta.url);
