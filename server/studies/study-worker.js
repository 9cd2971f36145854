/* global __filename */
'use strict';
// The entry Piscina starts in each study thread. A worker thread starts with plain Node: whatever made
// the parent understand TypeScript (tsx's loader under `npm start`, ts-jest's transform under jest)
// is not there, so this file is JavaScript and loads the TypeScript task through tsx's scoped require,
// which compiles it (and the engine it imports) on the fly in this thread only. See README.md here.
const tsx = require('tsx/cjs/api');

module.exports = tsx.require('./study-task.ts', __filename).runStudyTask;
