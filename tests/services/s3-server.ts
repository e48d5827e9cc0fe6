/**
 * `node --import tsx tests/services/s3-server.ts PORT DIR BUCKET`: s3rver, the S3-compatible test
 * store, on 127.0.0.1:PORT keeping objects in DIR, with BUCKET made. Stops on SIGTERM/SIGINT.
 */
import S3rver from 's3rver';

const [port, directory, bucket] = process.argv.slice(2);
if (!port || !directory || !bucket) {
  process.stderr.write('usage: s3-server.ts PORT DIR BUCKET\n');
  process.exit(64);
}
const server = new S3rver({
  address: '127.0.0.1',
  port: Number(port),
  directory,
  silent: true,
  configureBuckets: [{ name: bucket }],
});
await server.run();
const stop = () => {
  server.close().then(
    () => process.exit(0),
    () => process.exit(1),
  );
};
process.once('SIGTERM', stop);
process.once('SIGINT', stop);
