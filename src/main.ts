import { bootstrapApplication } from '@angular/platform-browser';
import { config as zodConfig } from 'zod';
import { App } from './app/app';
import { appConfig } from './app/app.config';

// zod compiles object parsers with `new Function` after probing whether eval is allowed; our
// Content-Security-Policy forbids it, so the probe logs a violation. Interpret instead (before any parse).
zodConfig({ jitless: true });

bootstrapApplication(App, appConfig).catch((error: unknown) => console.error(error));
