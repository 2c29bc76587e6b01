/** Version printed by --version and written into reports. */
export const VERSION = '0.2.0';

/** The program and version written into every report (`generatedBy`, `tool`). */
export const TOOL = `loopwise ${VERSION}`;
