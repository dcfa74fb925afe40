import { MAX_UPLOAD_BYTES } from "~/core/lab-data/limits";

/**
 * Upload limits the browser checks before sending (the server enforces them again while reading the request):
 * the parser's own limit, from its one declaration.
 */
export const UPLOAD_LIMIT_BYTES = MAX_UPLOAD_BYTES;
export const UPLOAD_ACCEPT =
  ".csv,.tsv,.txt,.xlsx,.xlsm,text/csv,application/vnd.openxmlformats-officedocument.spreadsheetml.sheet";
