import { ROLE_LABELS } from '@shared/auth/roles';
import { DEMO_ORGANISATIONS, DEMO_PASSWORD, DEMO_USERS } from './demo-scenario';

/** Printed by the start command once the server answers. */
const url = process.argv[2] ?? 'http://127.0.0.1:4280';
const orgName = (key: string) => DEMO_ORGANISATIONS.find((o) => o.key === key)!.name;
const lines = [
  '',
  `  Rillmark is running at ${url}`,
  `  Development outbox (mail the app sent): ${url}/admin/outbox (sign in as an administrator; each sees only`,
  `  their own organisation's mail). A development feature: the server refuses it with NODE_ENV=production.`,
  '',
  `  Demo sign-ins (password for all: ${DEMO_PASSWORD})`,
  ...DEMO_USERS.map((u) => `    ${ROLE_LABELS[u.role].padEnd(20)} ${u.email.padEnd(40)} ${orgName(u.organisation)}`),
  '',
  '  If the server dies it is restarted (the reason is logged). Press Ctrl-C to stop the server, the fake SMTP',
  '  server, the weather feed and MariaDB.',
  '',
];
console.log(lines.join('\n'));
