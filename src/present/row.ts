// A row of a facts or figures table, as pages, review packs and PDFs print it.

export interface Row {
  label: string;
  value: string;
  note?: string;
}
