import type { Handle } from '@sveltejs/kit';

// Auth.js hands authorize() the Request but not SvelteKit's getClientAddress(). This handle puts
// the address (adapter-node's, which honours ADDRESS_HEADER / XFF_DEPTH behind a proxy) in a
// header of our own, after dropping any value a client sent, so the password gate can count
// attempts per address whichever door the request came through.
export const CLIENT_ADDRESS_HEADER = 'x-squishline-client-address';

export const clientAddress: Handle = ({ event, resolve }) => {
	event.request.headers.delete(CLIENT_ADDRESS_HEADER);
	let address = 'unknown';
	try {
		address = event.getClientAddress();
	} catch {
		/* not served through adapter-node (a test calling a handler directly) */
	}
	event.request.headers.set(CLIENT_ADDRESS_HEADER, address);
	return resolve(event);
};
