/**
 * Limits of an upload, declared once: the parser enforces them, the upload page checks them in the browser
 * before sending (this module imports nothing, so the browser bundle takes only these numbers).
 */

/** Largest upload accepted: 5 MB. */
export const MAX_UPLOAD_BYTES = 5 * 1024 * 1024;
