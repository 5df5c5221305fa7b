// Every property test and fuzz run uses one fixed seed unless asked otherwise, so that a test
// run's verdict never depends on chance (a failing CI run does not land). To explore new
// inputs, run with FAST_CHECK_SEED=random, or give a number to replay a printed failure.
import fc from 'fast-check';

const setting = process.env.FAST_CHECK_SEED;
if (setting !== 'random') {
	const seed = setting === undefined ? 20261202 : Number(setting);
	if (!Number.isInteger(seed)) throw new Error(`FAST_CHECK_SEED must be an integer or "random", not "${setting}"`);
	fc.configureGlobal({ seed });
}
