import api from '../package.json' with { type: 'json' };

/** The version in apps/api/package.json (built into dist/api by scripts/build-api.ts). */
export const version: string = api.version;
