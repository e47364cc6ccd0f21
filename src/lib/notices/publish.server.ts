// Told when a version is published, so followers can be e-mailed the note and the what-changed summary.

export interface PublishedNotice {
  brandId: string;
  brandName: string;
  slug: string;
  versionNumber: number;
  note: string;
  publishedBy: { id: string; name: string };
  /** Plain-language lines from the what-changed view, e.g. "Colour Roast: #4a2c21 → #512f22". */
  summary: string[];
}

/** Called after the publishing transaction commits. */
export async function notifyPublished(_notice: PublishedNotice): Promise<void> {
  // Filled by the e-mail work: followers of the brand receive the notice.
}
