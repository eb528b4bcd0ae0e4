// Limits of one bulk import, shared by the route and the upload form.
export const IMPORT_MAX_BYTES = 2 * 1024 * 1024;
export const IMPORT_MAX_TUNES = 300;
export const IMPORT_FILE_NAME = /\.abc$/i;
