// Runtime half of the typed odex wrapper: re-exports the CommonJS Solver as a named ESM export.
// Types live in odex-reference.d.ts so strict tsc never type-checks odex's own src/odex.ts.
export { Solver } from 'odex';
