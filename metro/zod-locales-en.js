// Stands in for zod's `locales/index` in the app bundle (see metro.config.js): only `z.locales.en`
// exists on the client. The server runs under Node and keeps every locale.
export { default as en } from 'zod/v4/locales/en.js';
