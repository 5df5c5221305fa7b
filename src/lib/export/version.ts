/** The software version written into reports and exports (kept equal to package.json by a test). */
export const SOFTWARE_NAME = 'Causeway';
export const SOFTWARE_VERSION = '0.1.0';
