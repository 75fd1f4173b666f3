// Lets `npm run worker` load the app's server modules under plain Node (through tsx): their
// `import 'server-only'` guard throws outside React's server build, and the worker cannot run
// with `--conditions=react-server` because that also swaps React for its server build, which
// libraries such as the PDF renderer and Next's own helpers cannot run on. So this one
// package resolves to an empty module here; everywhere else the guard stands.
import { register } from 'node:module';

register(
  'data:text/javascript,' +
    encodeURIComponent(`
export async function resolve(specifier, context, next) {
  if (specifier === 'server-only') return { url: 'data:text/javascript,export {}', shortCircuit: true };
  return next(specifier, context);
}
`),
);
