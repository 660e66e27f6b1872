import { bootstrapApplication } from '@angular/platform-browser';
import { App } from './app/app';
import { appConfig } from './app/app.config';
import { interpretZodParsers } from './zod-jitless';

// Before any parse: zod's eval probe would trip the Content-Security-Policy.
interpretZodParsers();

bootstrapApplication(App, appConfig).catch((error: unknown) => console.error(error));
