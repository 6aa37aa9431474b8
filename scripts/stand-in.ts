/** Runs the OAuth stand-in on its own (the test suite starts it this way). */
import { startStandIn } from '../api/auth/stand-in';

const port = Number(process.argv[2] ?? 8079);
startStandIn(port).then(
  (s) => {
    console.log(`stand-in ready on ${s.url}`);
    const stop = () => s.stop().then(() => process.exit(0));
    process.once('SIGTERM', stop);
    process.once('SIGINT', stop);
  },
  (err: Error) => {
    console.error(`stand-in could not start: ${err.message}`);
    process.exit(1);
  },
);
