// Starts the built app for a local demo. adapter-node assumes https unless ORIGIN says otherwise,
// and form posts are refused when the origin does not match, so the demo names its own.
process.env.PORT ??= '3000';
process.env.ORIGIN ??= `http://localhost:${process.env.PORT}`;
console.log(`Tunnelwright demo: open ${process.env.ORIGIN} (Ctrl-C stops it)`);
await import('./serve.js');
