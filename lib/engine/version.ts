// Semver of the computation; stored with each screening so old sheets say which rules made them.
export const ENGINE_VERSION = '0.3.0';
