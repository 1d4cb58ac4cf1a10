// Starts the built app for a local demo. adapter-node assumes https unless ORIGIN says otherwise,
// and form posts are refused when the origin does not match, so the demo names its own.
process.env.PORT ??= '3000';
process.env.ORIGIN ??= `http://localhost:${process.env.PORT}`;
// Room for a 24 MiB readings file (and 10 MiB drawings); adapter-node's default is 512 kB.
process.env.BODY_SIZE_LIMIT ??= '25M';
console.log(`Tunnelwright demo: open ${process.env.ORIGIN} (Ctrl-C stops it)`);
await import('../build/index.js');
