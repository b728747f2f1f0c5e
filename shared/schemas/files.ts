/** A kept file (mill certificate, furnace chart) as the answers name it, with the address that downloads it. */
export interface StoredFileJson {
  id: string;
  filename: string;
  contentType: string;
  sizeBytes: number;
  sha256: string;
  uploadedAt: string;
  url: string;
}
