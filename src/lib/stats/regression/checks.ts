/**
 * Rules of thumb reported beside regression estimates, labelled as such. O(1).
 */

export interface EventsPerVariable {
	/** The smaller of events and non-events, per model parameter (intercept excluded). */
	epv: number;
	limitingCount: number;
	parameters: number;
	/** Fewer than 10 events per variable. */
	belowRuleOfThumb: boolean;
	message: string;
}

/**
 * Events per variable: min(events, non-events) / parameters. Below about 10 the logistic
 * estimates may be biased and their intervals wrong — a rule of thumb from Peduzzi et al.
 * (J Clin Epidemiol 1996), not a hard limit.
 */
export function eventsPerVariable(events: number, nonEvents: number, parameters: number): EventsPerVariable {
	const limitingCount = Math.min(events, nonEvents);
	const epv = parameters > 0 ? limitingCount / parameters : Infinity;
	const belowRuleOfThumb = epv < 10;
	return {
		epv,
		limitingCount,
		parameters,
		belowRuleOfThumb,
		message: belowRuleOfThumb
			? `Only ${epv.toFixed(1)} outcome events per model parameter (${limitingCount} / ${parameters}); about 10 is a common rule of thumb (Peduzzi et al., J Clin Epidemiol 1996).`
			: `${epv.toFixed(1)} outcome events per model parameter (rule of thumb: about 10, Peduzzi et al. 1996).`
	};
}

export interface ChangeInEstimate {
	/** 100 · (adjusted − crude) / crude, on the scale given. */
	percent: number;
	scale: 'ratio' | 'difference';
	/** |percent| ≥ 10. */
	atLeastTenPercent: boolean;
	note: string;
}

/**
 * Change in estimate from crude to adjusted, in percent of the crude estimate. For ratio
 * measures (odds ratios) the ratios themselves are compared; for differences
 * (regression coefficients of a linear model) the coefficients. The 10 % marker is common
 * practice with no single source; Maldonado & Greenland (Am J Epidemiol 1993) studied
 * its performance as a confounder-selection rule.
 */
export function changeInEstimate(crude: number, adjusted: number, scale: 'ratio' | 'difference'): ChangeInEstimate {
	const percent = (100 * (adjusted - crude)) / crude;
	const atLeastTenPercent = Math.abs(percent) >= 10;
	return {
		percent,
		scale,
		atLeastTenPercent,
		note: `${percent >= 0 ? '+' : ''}${percent.toFixed(1)} % from crude to adjusted; a 10 % change is a common-practice marker (studied by Maldonado & Greenland, Am J Epidemiol 1993), not a test of confounding — the diagram decides what to adjust for.`
	};
}
