import type { Plugin } from 'vite';

/** The Latin files of the three weights the shop draws with (regular, semibold, bold). */
const FIRST_FONTS = /source-sans-3-latin-(400|600|700)-normal-[\w-]+\.woff2$/;

/**
 * Asks for the web fonts from the page's head, beside the stylesheet, instead of when the first text is laid out: they
 * then arrive before the first answers are drawn, so text does not re-wrap in the narrower web font under a list
 * already on screen (layout shift). Only the Latin files of the weights used are preloaded; other subsets stay on
 * demand (their unicode-range).
 */
export function preloadFontsPlugin(): Plugin {
  return {
    name: 'spoolyard-preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(_html, ctx) {
        const files = Object.keys(ctx.bundle ?? {}).filter((f) => FIRST_FONTS.test(f)).sort();
        return files.map((f) => ({ tag: 'link', attrs: { rel: 'preload', href: `/${f}`, as: 'font', type: 'font/woff2', crossorigin: '' }, injectTo: 'head' as const }));
      },
    },
  };
}
