import packageJson from '../../package.json' with { type: 'json' };

/** The app version, from package.json (inlined into the built CLI). */
export const VERSION: string = packageJson.version;
