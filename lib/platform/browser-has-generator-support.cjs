'use strict';
// Stands in for @stdlib/assert-has-generator-support in the browser bundle (next.config.mjs):
// the original probes with `new Function`, which the pages' Content-Security-Policy (no
// 'unsafe-eval') reports as a violation. Every browser the app supports has generator functions.
module.exports = function hasGeneratorSupport() {
  return true;
};
