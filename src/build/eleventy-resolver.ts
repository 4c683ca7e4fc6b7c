// Evaluated before eleventy is (eleventy.ts imports it first). On Node 20 eleventy registers a module
// resolution hook (module.register) so that its watch mode re-imports the JavaScript config and data files
// that change: that starts a loader thread, and every module the process resolves after it goes through
// that thread and back. A build never changes a file eleventy imports (the templates are Nunjucks, read
// by every run, and the config is the package's own), so the hook is left out, with the switch eleventy
// reads for that. In a 1,000-part build's CPU profile the hook cost about a second: the loader thread's
// own start, and this thread waiting on it.

process.env.ELEVENTY_SKIP_ESM_RESOLVER ??= '1';

export {};
