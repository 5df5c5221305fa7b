/** A CPU-time lap counter for the benchmark children: each call returns the user + system milliseconds since the last. */
export function cpuLap(): () => number {
	let since = process.cpuUsage();
	return () => {
		const d = process.cpuUsage(since);
		since = process.cpuUsage();
		return (d.user + d.system) / 1000;
	};
}
