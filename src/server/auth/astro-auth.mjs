// auth-astro ships TypeScript sources that do not pass this project's strict type check; this
// re-export (with its declaration beside it) keeps them out of `npm run check` while the build
// uses auth-astro exactly as published.
export { AstroAuth } from 'auth-astro/server';
