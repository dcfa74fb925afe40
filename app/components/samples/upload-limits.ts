/**
 * Upload limits the browser checks before sending (the server enforces them again while reading the request).
 * Kept equal to MAX_UPLOAD_BYTES of app/core/lab-data by a unit test (app/.server/samples/upload.test.ts).
 */
export const UPLOAD_LIMIT_BYTES = 5 * 1024 * 1024;
export const UPLOAD_ACCEPT =
  ".csv,.tsv,.txt,.xlsx,.xlsm,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
