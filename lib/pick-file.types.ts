/** A file the person chose, ready to go into a multipart body. */
export type PickedFile = {
  name: string;
  /** Bytes, when the platform reports it. */
  size: number | null;
  /** Adds the file to a form under the given field name. */
  appendTo(form: FormData, field: string): void;
};

/** What the picker offers: CSV and plain text (some systems label CSV exports text/plain). */
export const CSV_TYPES = ['text/csv', 'text/plain', 'application/vnd.ms-excel', '.csv'];

/** What the picker offers for district boundaries: GeoJSON (often saved as .json, or with no type at all). */
export const GEOJSON_TYPES = ['application/geo+json', 'application/json', '.geojson', '.json'];
