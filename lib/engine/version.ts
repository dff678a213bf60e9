/** Semantic version of the verification engine, written into every report. Bump on any change that can alter a report. */
export const ENGINE_VERSION = "0.1.0";
