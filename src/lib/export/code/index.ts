/**
 * Analysis code for a chosen adjustment set, in R, Stata, SAS or Python, from the diagram and
 * the data settings (column names, kinds, reference levels, the file's delimiter): the same
 * models Causeway fits, so that an analyst can rerun them in the software of the analysis
 * plan. `analysisCode(language, spec)`; `codeSpec(…)` builds the spec from a data-check report.
 * Deterministic: the same input gives the same text (no date).
 */
import type { CodeLanguage } from '../../wording/analysis-code';
import { pythonCode } from './python';
import { rCode } from './r';
import { sasCode } from './sas';
import type { CodeSpec } from './spec';
import { stataCode } from './stata';

export { codeSpec, type CodeSpec, type CodeSetChoice } from './spec';
export type { CodeLanguage } from '../../wording/analysis-code';
export { CODE_LANGUAGE_NAME } from '../../wording/analysis-code';

export const CODE_LANGUAGES: readonly CodeLanguage[] = ['r', 'stata', 'sas', 'python'];

/** File extension and media type of each language's script. */
export const CODE_FILE: Readonly<Record<CodeLanguage, { extension: string; mime: string }>> = {
	r: { extension: '.R', mime: 'text/plain' },
	stata: { extension: '.do', mime: 'text/plain' },
	sas: { extension: '.sas', mime: 'text/plain' },
	python: { extension: '.py', mime: 'text/x-python' }
};

export const isCodeLanguage = (name: string): name is CodeLanguage => (CODE_LANGUAGES as readonly string[]).includes(name);

export function analysisCode(language: CodeLanguage, spec: CodeSpec): string {
	switch (language) {
		case 'r':
			return rCode(spec);
		case 'stata':
			return stataCode(spec);
		case 'sas':
			return sasCode(spec);
		case 'python':
			return pythonCode(spec);
	}
}
