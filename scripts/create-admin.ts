// `npm run create-admin -- --email you@company.example --name "Your Name"`
// Creates an admin for a production workspace. The password is asked for (hidden) on a
// terminal, or read from the first line of stdin when piped. Stop the server first when
// using the embedded database: PGlite allows one process per data folder.
import { parseArgs } from 'node:util';
import { createInterface } from 'node:readline';
import { openDatabase } from '../src/db/client';
import { createUser, DuplicateEmailError } from '../src/db/queries/users';
import { hashPassword, MIN_PASSWORD_LENGTH } from '../src/lib/server/password';
import { newUserSchema } from '../src/schemas/auth';

function fail(message: string): never {
  process.stderr.write(`${message}\n`);
  process.exit(2);
}

async function readPassword(): Promise<string> {
  if (!process.stdin.isTTY) {
    const lines = createInterface({ input: process.stdin });
    for await (const line of lines) return line;
    return '';
  }
  process.stdout.write(`Password (at least ${MIN_PASSWORD_LENGTH} characters): `);
  process.stdin.setRawMode(true);
  let text = '';
  for await (const chunk of process.stdin) {
    for (const ch of String(chunk)) {
      if (ch === '\r' || ch === '\n') {
        process.stdin.setRawMode(false);
        process.stdout.write('\n');
        return text;
      }
      if (ch === '\u0003') process.exit(130);
      text = ch === '\u007f' ? text.slice(0, -1) : text + ch;
    }
  }
  return text;
}

const { values } = parseArgs({ options: { email: { type: 'string' }, name: { type: 'string' } } });
if (!values.email || !values.name) fail('usage: npm run create-admin -- --email ADDRESS --name "DISPLAY NAME"');
const password = await readPassword();
const parsed = newUserSchema.safeParse({ email: values.email, name: values.name, role: 'admin', password });
if (!parsed.success) fail(parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('\n'));

const database = await openDatabase({ databaseUrl: process.env.DATABASE_URL, dataDir: process.env.DATA_DIR ?? './data' });
try {
  const user = await createUser(
    database.db,
    { email: parsed.data.email, displayName: parsed.data.name, role: 'admin', passwordHash: await hashPassword(parsed.data.password) },
    null,
  );
  process.stdout.write(`Admin ${user.email} created (id ${user.id}).\n`);
} catch (error) {
  if (error instanceof DuplicateEmailError) fail(`${parsed.data.email} already belongs to a member.`);
  throw error;
} finally {
  await database.close();
}
