/**
 * Node-side specs build real apps on real SQLite files (the demo scenario takes a second or two
 * to load); on a busy 2-core machine Jasmine's 5 s default is too tight for a setup hook.
 */
jasmine.DEFAULT_TIMEOUT_INTERVAL = 30_000;
