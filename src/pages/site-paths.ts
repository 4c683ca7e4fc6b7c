// Where things go in a built site, by site-relative path: the PDFs of parts and review packs. Page folders
// are named in src/present/slugs.ts.

/** Where PDFs go in the site, when they are built. */
export const partPdfPath = (id: string) => `pdf/parts/${id}.pdf`;
export const reviewPdfPath = (slug: string) => `pdf/reviews/${slug}.pdf`;
