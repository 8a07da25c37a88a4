import { createInterface } from 'node:readline';
import { Writable } from 'node:stream';
import { newPasswordSchema } from '../shared/schemas/auth';
import { loadConfig } from '../server/config';
import { openAppDatabase } from '../server/db/database';
import { migrateToLatest } from '../server/db/migrate';
import { createAdmin } from '../server/services/first-admin';

// npm run admin:create -- EMAIL "FULL NAME"    password from ADMIN_PASSWORD or asked (not echoed)
const [email, ...nameParts] = process.argv.slice(2);
const name = nameParts.join(' ').trim();
if (!email || !name) {
  console.error('Usage: npm run admin:create -- EMAIL "Full Name"   (password from ADMIN_PASSWORD, else asked)');
  process.exit(2);
}

/** Reads a line without echoing it. */
async function ask(question: string): Promise<string> {
  process.stdout.write(question);
  const muted = new Writable({ write: (_c, _e, done) => done() });
  const rl = createInterface({ input: process.stdin, output: muted, terminal: true });
  const answer = await new Promise<string>((resolve) => rl.question('', resolve));
  rl.close();
  process.stdout.write('\n');
  return answer;
}

let password = process.env.ADMIN_PASSWORD;
if (!password) {
  if (!process.stdin.isTTY) {
    console.error('Set ADMIN_PASSWORD, or run this in a terminal to be asked for the password');
    process.exit(2);
  }
  password = await ask('Password for the new admin: ');
  if ((await ask('The same password again: ')) !== password) {
    console.error('The two passwords differ; nothing was created');
    process.exit(1);
  }
}
const parsed = newPasswordSchema.safeParse(password);
if (!parsed.success) {
  console.error(`Password refused: ${parsed.error.issues.map((i) => i.message).join('; ')}`);
  process.exit(1);
}

const config = loadConfig();
const db = openAppDatabase(config);
try {
  await migrateToLatest(db);
  const user = await createAdmin(db, { email, name, password: parsed.data });
  console.log(`admin ${user.email} (${user.name}) created in ${config.dataDir}; sign in at ${config.publicUrl}`);
} catch (err) {
  console.error(`not created: ${(err as Error).message}`);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
