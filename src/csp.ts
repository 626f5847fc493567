// Imported first by the app entry: the built app runs under a Content-Security-Policy without
// 'unsafe-eval', and zod 4 would otherwise probe `new Function` when its first object schema is built.
// The probe is caught, but Chromium still reports it as a CSP violation. With `jitless` zod never
// probes and parses the same way without generated code.
import { z } from 'zod';

z.config({ jitless: true });
