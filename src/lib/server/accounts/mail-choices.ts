import * as users from '../auth/users';
import { TOPICS, type Topic } from '../mail/unsubscribe';

/** Turns one kind of notification mail off, from a one-click unsubscribe link. */
export async function unsubscribe(userId: string, topic: Topic): Promise<void> {
	await users.update(userId, { [TOPICS[topic].field]: false });
}
