// astro:env/server for unit tests, which run server modules without Astro: the settings they read, from the
// environment, with the schema's defaults (astro.config.mjs) except the logger, which is quiet unless asked.
export const LOG_LEVEL = process.env.LOG_LEVEL ?? 'silent';
export const PROCESS_ROLE = process.env.PROCESS_ROLE === 'worker' ? 'worker' : 'web';
