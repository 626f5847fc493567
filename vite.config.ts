/// <reference types="vitest/config" />
import { defineConfig } from 'vite';
import react from '@vitejs/plugin-react';

// Two builds from one config: the web app (default) and the command-line tool (`--mode cli`),
// which bundles the core and the shipped data into one Node ES module.
export default defineConfig(({ mode }) =>
  mode === 'cli'
    ? {
        build: {
          ssr: 'src/cli/main.ts',
          outDir: 'dist/cli',
          emptyOutDir: true,
          target: 'node20',
          minify: false,
          rollupOptions: { output: { entryFileNames: 'osmocount.mjs' } },
        },
        ssr: { noExternal: true },
      }
    : {
        plugins: [react()],
        build: { outDir: 'dist/app', emptyOutDir: true, chunkSizeWarningLimit: 1500 },
        test: {
          environment: 'node',
          setupFiles: ['./src/test-setup.ts'],
          include: ['src/**/*.test.{ts,tsx}', 'test/**/*.test.{ts,tsx}'],
        },
      },
);
