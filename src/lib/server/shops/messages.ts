import { Failure } from '../../failure';
import type { CurrentUser } from '../auth/current-user';
import { messagesByAccount, messagesByAddress, spend, waitText } from '../auth/limits';
import { models, type Shop } from '../db/models';
import * as users from '../auth/users';
import { send } from '../mail/send';
import { shopMessage, shopReply } from './letters';
import { inTransaction } from '../db/transaction';

/**
 * A member writes to a shop through the app. The shop's owner gets the words and the sender's
 * name, never their address; the address is shown only after the shop replies through the app.
 */
export async function sendMessage(
	me: CurrentUser,
	shop: Shop,
	body: string,
	address: string,
	now: Date
) {
	return inTransaction(async () => {
		if (shop.ownerId === me.id) throw new Failure(400, 'That is your own shop.');
		const r = await spend([
			[messagesByAccount, me.id],
			[messagesByAddress, address]
		]);
		if (!r.ok)
			throw new Failure(
				429,
				`You have sent several messages in a short time. Try again in ${waitText(r.retryAfterS)}; your text is kept below.`
			);
		const m = await models().ShopMessage.create({
			shopId: shop.id,
			senderId: me.id,
			body,
			createdAt: now,
			updatedAt: now
		});
		const owner = await users.read(shop.ownerId);
		if (owner)
			await send(
				shopMessage({
					to: owner.email,
					shopId: shop.id,
					shopName: shop.name,
					senderName: me.name ?? 'A Squishline member',
					body
				})
			);
		return m;
	});
}

export type MessageView = {
	id: number;
	from: string;
	/** Shown to the shop only once it has replied. */
	fromEmail: string | null;
	body: string;
	at: string;
	reply: string | null;
	repliedAt: string | null;
};

export async function messagesOf(shopId: number): Promise<MessageView[]> {
	const { ShopMessage, User } = models();
	const rows = await ShopMessage.findAll({
		where: { shopId },
		include: [{ model: User, as: 'sender', attributes: ['name', 'email'] }],
		order: [['createdAt', 'DESC']],
		limit: 100
	});
	return rows.map((m) => ({
		id: m.id,
		from: m.sender?.name ?? 'A Squishline member',
		fromEmail: m.repliedAt ? (m.sender?.email ?? null) : null,
		body: m.body,
		at: m.createdAt.toISOString(),
		reply: m.reply,
		repliedAt: m.repliedAt?.toISOString() ?? null
	}));
}

/** The shop answers once through the app; the sender gets the reply and the shop's address. */
export async function replyToMessage(
	me: CurrentUser,
	shop: Shop,
	messageId: number,
	reply: string,
	now: Date
) {
	return inTransaction(async () => {
		const { ShopMessage } = models();
		const m = await ShopMessage.findOne({ where: { id: messageId, shopId: shop.id } });
		if (!m) throw new Failure(404, 'No such message to your shop.');
		if (m.repliedAt)
			throw new Failure(409, 'This message has its reply; write to the sender directly now.');
		await m.update({ reply, repliedAt: now, repliedBy: me.id, updatedAt: now });
		const sender = await users.read(m.senderId);
		if (sender)
			await send(
				shopReply({
					to: sender.email,
					shopId: shop.id,
					shopName: shop.name,
					original: m.body,
					reply,
					shopAddress: me.email
				})
			);
	});
}
