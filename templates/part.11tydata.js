// The part page's address and title, as functions of its part: written as nunjucks strings in part.njk's
// front matter, eleventy parsed and compiled each of them again for every page (a fifth of the part pages'
// rendering in a CPU profile of a 1,000-part build). A part id is letters, digits, ".", "_" and "-" only
// (src/model/part.ts), so nothing in it is escaped either way.
export default {
  permalink: (data) => `parts/${data.p.id}/index.html`,
  eleventyComputed: {
    // Computed titles stay raw text: the layout escapes {{ title }} once.
    title: (data) => data.p.id,
  },
};
