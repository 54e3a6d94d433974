/** The service's release version (kept equal to package.json's by a test). */
export const APP_VERSION = '0.4.0';
