// The error answer every route shares, without zod so the client may import it.

/** One field the server refused, and why (the message names the unit where there is one). */
export interface FieldError {
  field: string;
  message: string;
}

/** An RFC 9457 problem document as the API sends it. */
export interface Problem {
  type: string;
  title: string;
  status: number;
  detail?: string;
  instance?: string;
  /** For validation failures: which field and why. */
  errors?: FieldError[];
}
