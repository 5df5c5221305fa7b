// Build-time replacement for @stdlib/assert-has-generator-support (vite.config.ts and
// scripts/build-cli.mjs alias it here). The original feature-tests generator support by
// handing source text to `eval`, which the app's Content-Security-Policy forbids (the browser
// reports a violation on every load) and which we ship nowhere. Every browser and Node
// version the app supports has native generators (ES2015), so the answer is a constant.
'use strict';

module.exports = function hasGeneratorSupport() {
	return true;
};
