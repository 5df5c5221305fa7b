/** Source of the standalone validator that ajv generates for a JSON Schema. */
export declare function generateValidatorSource(schema: object): string;
