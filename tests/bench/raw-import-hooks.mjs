// Node module hooks for the benchmark scripts: `import text from './file.css?raw'` gives the file's
// text, as Vite does, so code written for the browser build (the cloth worker's painters read the
// theme's colours that way) runs under tsx too. Registered with `module.register`.
import { readFile } from 'node:fs/promises';

export async function resolve(specifier, context, next) {
  if (specifier.endsWith('?raw')) return { url: new URL(specifier, context.parentURL).href, shortCircuit: true };
  return next(specifier, context);
}

export async function load(url, context, next) {
  if (url.endsWith('?raw')) {
    const text = await readFile(new URL(url.slice(0, -'?raw'.length)), 'utf8');
    return { format: 'module', source: `export default ${JSON.stringify(text)};`, shortCircuit: true };
  }
  return next(url, context);
}
