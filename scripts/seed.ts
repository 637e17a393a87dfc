// Loads the invented demo scenario. Safe to run again: whatever exists is left as it is.
import fs from 'node:fs';
import { closeDb } from '../src/lib/server/db/connection';
import * as users from '../src/lib/server/auth/users';
import type { Role } from '../src/lib/roles';
import { seedBuilds } from './demo/builds';
import { seedOneChange } from './demo/one-change';
import { seedShops } from './demo/shops';
import { seedScooters } from './demo/scooters';

type Person = { email: string; name: string; role: Role; units?: 'metric' | 'imperial' };
const demo = JSON.parse(
	fs.readFileSync(new URL('./demo/people.json', import.meta.url), 'utf8')
) as {
	passwords: Record<Role, string>;
	people: Person[];
};

let added = 0;
for (const p of demo.people) {
	if (await users.readByEmail(p.email)) continue;
	await users.create({ ...p, password: demo.passwords[p.role], verified: true });
	added++;
}
console.log(`  ${added} demo accounts added, ${demo.people.length - added} already there`);

const owners: string[] = [];
for (const p of demo.people) {
	if (p.role !== 'member' && p.role !== 'shop') continue;
	const u = await users.readByEmail(p.email);
	if (u) owners.push(u.id);
}
const scooters = await seedScooters();
console.log(`  ${scooters.size} base scooters in the catalogue`);
const builds = await seedBuilds(owners, scooters);
const steady = await seedOneChange(owners, scooters);
console.log(`  ${builds + steady} demo build sheets added`);
console.log(`  ${await seedShops()} demo shop pages added`);
await closeDb();
