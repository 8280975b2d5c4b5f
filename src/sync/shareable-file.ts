/** A file as the app hands it out (shared, downloaded or written): plain text with its name and media type. */
export interface ShareableFile {
  name: string;
  text: string;
  /** e.g. "application/json" or "text/csv". */
  type: string;
}
