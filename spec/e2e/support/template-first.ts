/**
 * A Jasmine helper of the end-to-end run: builds the demo template database (the demo and every profile
 * fitted, about 30 s of CPU on a quiet core) once, before the first suite, under its own ceiling. Built
 * inside the first suite's `beforeAll` it would eat that hook's time limit on a busy machine.
 */
import { demoTemplate } from './server';

beforeAll(() => {
  demoTemplate();
}, 600_000);
