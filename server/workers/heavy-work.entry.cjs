'use strict';
// Worker threads do not inherit the parent's TypeScript loader (tsx, or jest's transform):
// register tsx here so the worker runs the same TypeScript sources as the server.
require('tsx/cjs');
module.exports = require('./heavy-work.ts');
