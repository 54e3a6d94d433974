// Run in a fresh process: prints the milliseconds that importing the module named by argv[2] takes.
const specifier = process.argv[2];
const t0 = performance.now();
await import(specifier);
console.log((performance.now() - t0).toFixed(2));
