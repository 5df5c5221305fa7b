// Types for the generated validator (scripts/build-schema-validator.mjs).
import type { ErrorObject } from 'ajv';

export interface GeneratedValidator {
	(data: unknown): boolean;
	errors?: ErrorObject[] | null;
}
export declare const validate: GeneratedValidator;
export default validate;
