import { fileURLToPath, URL } from 'node:url';
import vue from '@vitejs/plugin-vue';
import { defineConfig, type Plugin } from 'vite';

// The faces every page draws with (client/main.ts imports them), Latin subset: preloaded from
// index.html so they arrive beside the scripts and the first paint already uses them, instead
// of being found only when the app renders text and then swapped in (text reflows, shifts).
const PRELOADED_FONTS = [
  /^assets\/lora-latin-700-normal-[\w-]+\.woff2$/,
  /^assets\/source-sans-3-latin-400-normal-[\w-]+\.woff2$/,
  /^assets\/source-sans-3-latin-600-normal-[\w-]+\.woff2$/,
];

function preloadFonts(): Plugin {
  return {
    name: 'rindwise:preload-fonts',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler(_html, { bundle }) {
        const files = Object.keys(bundle ?? {}).filter((f) =>
          PRELOADED_FONTS.some((r) => r.test(f)),
        );
        if (files.length !== PRELOADED_FONTS.length)
          throw new Error(`preload-fonts: found ${files.join(', ') || 'none'} in the bundle`);
        return files.map((f) => ({
          tag: 'link',
          attrs: { rel: 'preload', href: `/${f}`, as: 'font', type: 'font/woff2', crossorigin: '' },
          injectTo: 'head' as const,
        }));
      },
    },
  };
}

// The client lives in client/; shared/ is imported by both sides through '@shared'.
export default defineConfig({
  plugins: [vue(), preloadFonts()],
  resolve: {
    alias: {
      '@client': fileURLToPath(new URL('./client', import.meta.url)),
      '@shared': fileURLToPath(new URL('./shared', import.meta.url)),
    },
  },
  build: {
    outDir: 'dist',
    emptyOutDir: true,
    sourcemap: false,
    chunkSizeWarningLimit: 900,
  },
  server: {
    proxy: {
      '/api': { target: process.env.API_TARGET ?? 'http://127.0.0.1:3001', changeOrigin: false },
    },
  },
});
