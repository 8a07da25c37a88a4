import type { Role } from '../../../shared/auth/roles';
import { DEMO_PEOPLE } from '../demo/people';
import { pick, type Rand } from './text';

export interface BenchPerson {
  email: string;
  name: string;
  role: Role;
}

// invented given and family names, combined at random
const GIVEN = ['Ilse', 'Tomasz', 'Nkechi', 'Ruairi', 'Hana', 'Emeka', 'Saoirse', 'Joaquin', 'Mirela', 'Tarek', 'Ylva', 'Devika', 'Bram', 'Amara', 'Kenji', 'Liesel', 'Ostap', 'Priya', 'Fenna', 'Caio'];
const FAMILY = ['Halloran', 'Vesterby', 'Okonkwo', 'Marchetti', 'Lindqvist', 'Abernethy', 'Szabo', 'Trevanion', 'Kowalczyk', 'Adeyemi', 'Rautio', 'Castellan', 'Moerdijk', 'Quenneville', 'Barrowby'];

/**
 * The demo team (so the demo accounts sign in to the big casebook too) and `extra` more
 * engineers and moderators of the same invented company.
 */
export function benchPeople(r: Rand, extra: number): BenchPerson[] {
  const people: BenchPerson[] = DEMO_PEOPLE.map((p) => ({ email: p.email, name: p.name, role: p.role }));
  const taken = new Set(people.map((p) => p.email));
  for (let i = 0; people.length < DEMO_PEOPLE.length + extra; i++) {
    const name = `${pick(r, GIVEN)} ${pick(r, FAMILY)}`;
    const email = `${name.toLowerCase().replace(/\s+/g, '.')}${i > 200 ? i : ''}@falsetrace.test`;
    if (taken.has(email)) continue;
    taken.add(email);
    // about one in eight reviews
    people.push({ email, name, role: i % 8 === 3 ? 'moderator' : 'engineer' });
  }
  return people;
}
