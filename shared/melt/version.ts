/** Version of the melt engine; a run records it so results can be traced to the code. Semver. */
export const ENGINE_VERSION = '2.1.0';
