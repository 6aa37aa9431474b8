/**
 * Runs the OAuth stand-in on its own (the test suite starts it this way). Under jest
 * (NODE_ENV=test) it also answers the test-only identities (`#unverified`, `#sub=…`,
 * `#hd=…` after the login hint) that the sign-in refusal tests use.
 */
import { startStandIn } from '../api/auth/stand-in';

const port = Number(process.argv[2] ?? 8079);
const testIdentities = process.env.NODE_ENV === 'test';
startStandIn(port, '127.0.0.1', { testIdentities }).then(
  (s) => {
    console.log(`stand-in ready on ${s.url}${testIdentities ? ' (test identities on)' : ''}`);
    const stop = () => s.stop().then(() => process.exit(0));
    process.once('SIGTERM', stop);
    process.once('SIGINT', stop);
  },
  (err: Error) => {
    console.error(`stand-in could not start: ${err.message}`);
    process.exit(1);
  },
);
