/**
 * Preloaded into the language server under test (`node --require`, which also reaches its worker
 * threads): records the path of every file opened through node's fs module, one per line, in the
 * file named by RECTILENS_OPEN_LOG. The second witness besides strace, and the only one where strace
 * is missing. Paths are resolved against the working folder; the log itself is written with the
 * original functions, so it does not record itself.
 */
'use strict';
const fs = require('node:fs');
const path = require('node:path');

const logPath = process.env.RECTILENS_OPEN_LOG;
if (logPath) {
  const original = { openSync: fs.openSync, writeSync: fs.writeSync };
  const log = original.openSync(logPath, 'a');
  const note = (target) => {
    if (typeof target === 'string' || target instanceof URL || Buffer.isBuffer(target)) {
      const text = target instanceof URL ? target.pathname : String(target);
      original.writeSync(log, `${path.resolve(text)}\n`);
    }
  };
  const wrap = (owner, name) => {
    const fn = owner[name];
    owner[name] = function (target, ...rest) {
      note(target);
      return fn.call(this, target, ...rest);
    };
  };
  for (const name of ['openSync', 'open', 'readFileSync', 'readFile', 'createReadStream']) wrap(fs, name);
  for (const name of ['open', 'readFile']) wrap(fs.promises, name);
}
