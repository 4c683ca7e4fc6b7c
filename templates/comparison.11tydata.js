// The comparison page's address and title, as functions of its comparison: written as nunjucks strings in
// comparison.njk's front matter, eleventy parsed and compiled each of them again for every page, as it did
// the part page's (part.11tydata.js). A slug is letters, digits, ".", "_" and "-" only (pageName in
// src/model/page-names.ts), so nothing in it is escaped either way.
export default {
  permalink: (data) => `comparisons/${data.c.slug}/index.html`,
  eleventyComputed: {
    // Computed titles stay raw text: the layout escapes {{ title }} once.
    title: (data) => data.c.title,
  },
};
