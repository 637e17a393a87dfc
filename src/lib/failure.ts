/**
 * A refusal with its status and the fields at fault: the JSON API answers it as
 * { error, issues }, and form actions show the message beside the field.
 */
export class ApiFailure extends Error {
	constructor(
		readonly status: number,
		message: string,
		readonly issues: { path: string; message: string }[] = []
	) {
		super(message);
	}
}
