/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';
import type { Plugin, UserConfig } from 'vite';

/**
 * The built app's Content-Security-Policy: nothing but its own files, no inline scripts or styles, no
 * network beyond its origin. Added at build time only (the dev server's hot reload needs inline scripts).
 */
export const CONTENT_SECURITY_POLICY = [
  "default-src 'none'", "script-src 'self'", "style-src 'self'", "img-src 'self' data: blob:", "font-src 'self'",
  "connect-src 'self'", "worker-src 'self' blob:", "manifest-src 'self'", "base-uri 'none'", "form-action 'none'", "object-src 'none'",
].join('; ');

function contentSecurityPolicy(): Plugin {
  return {
    name: 'osmocount-csp',
    apply: 'build',
    transformIndexHtml: {
      order: 'post',
      handler: (html) => html.replace('<head>', `<head>\n    <meta http-equiv="Content-Security-Policy" content="${CONTENT_SECURITY_POLICY}" />`),
    },
  };
}

// Two builds from one config: the web app (default) and the command-line tool (`--mode cli`),
// which bundles the core and the shipped data into one Node ES module.
/** A Node bundle (the CLI, the benchmarks): core and shipped data in one ES module. */
function nodeBundle(entry: string, outDir: string, fileName: string): UserConfig {
  return {
    build: {
      ssr: entry,
      outDir,
      emptyOutDir: true,
      target: 'node20',
      minify: false,
      rollupOptions: { output: { entryFileNames: fileName } },
    },
    ssr: { noExternal: true },
    // React (the printouts' HTML renderer) in its production build, not chosen at run time.
    define: { 'process.env.NODE_ENV': JSON.stringify('production') },
  };
}

export default defineConfig(({ mode }) =>
  mode === 'cli'
    ? nodeBundle('src/cli/main.ts', 'dist/cli', 'osmocount.mjs')
    : mode === 'bench'
    ? nodeBundle('test/bench/bench.ts', 'dist/bench', 'bench.mjs')
    : mode === 'profile'
    ? nodeBundle('test/bench/profile.ts', 'dist/profile', 'profile.mjs')
    : {
        plugins: [react(), contentSecurityPolicy()],
        build: { outDir: 'dist/app', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
        test: {
          environment: 'node',
          setupFiles: ['./src/test-setup.ts'],
          css: { include: [/print\.css/] },
          include: ['src/**/*.test.{ts,tsx}', 'test/**/*.test.{ts,tsx}'],
        },
      },
);
