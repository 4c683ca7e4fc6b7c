// Eleventy configuration for the folio site. The build (src/build) computes every figure and chart first and
// hands them to eleventy as global data (`folio`); templates only lay out what they are given.
export default function (eleventyConfig) {
  eleventyConfig.setQuietMode(true);
  // Everything from a library file is escaped unless a template marks computed markup (SVG) as safe.
  eleventyConfig.setNunjucksEnvironmentOptions({ autoescape: true, throwOnUndefined: false });
  // The input folder is the package's templates/, passed by src/build/eleventy.ts; these are relative to it.
  return {
    dir: { includes: '_includes', data: '_data' },
    templateFormats: ['njk'],
    htmlTemplateEngine: 'njk',
  };
}
