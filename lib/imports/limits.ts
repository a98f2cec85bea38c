/** Size limits of what the product accepts from a user's file (issue 6: uploads). */
import { AppError } from "@/lib/errors";

/** A target list (CSV or VOTable) is at most 5 MiB. */
export const MAX_IMPORT_BYTES = 5 * 1024 * 1024;

/** A target list has at most 10,000 data rows, so one import stays one bounded transaction. */
export const MAX_IMPORT_ROWS = 10_000;

/**
 * A table file past MAX_IMPORT_ROWS, refused by every reader (CSV, ECSV, VOTable) as soon as the row
 * after the limit is read; a reader of a particular kind of table may say it in that table's words.
 */
export class TooManyRowsError extends AppError {
  constructor() {
    super("bad_request:import", `The file has more than ${MAX_IMPORT_ROWS.toLocaleString("en-US")} data rows; split it into smaller lists.`);
  }
}

/** A note attachment (PNG, JPEG, PDF, FITS) is at most 16 MiB. */
export const MAX_ATTACHMENT_BYTES = 16 * 1024 * 1024;

/** A FITS attachment's headers are listed for at most 64 HDUs; past them the list says more HDUs follow (our rule). */
export const MAX_FITS_HDUS = 64;

/** At most 1,000 cards of one FITS header are kept; past them the list says how many more there are (our rule). */
export const MAX_FITS_CARDS_PER_HDU = 1_000;
