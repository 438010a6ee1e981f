// The settings check, as an entry of its own in the server build (dist/server/config-check.mjs), so
// scripts/serve.mjs can refuse a bad environment before it loads the app at all.
export { checkEnvironment } from '../config';
