/**
 * The local upload fake in a process of its own, for benchmarks that measure their own memory:
 * `tsx tests/bench/upload-fake-process.ts <port> <dir>` prints the SDK's env as one JSON line.
 */
import { startUploadFake } from '@/server/dev/upload-fake';

const [port, dir] = process.argv.slice(2);
const fake = await startUploadFake({ port: Number(port), dir: dir! });
process.stdout.write(`${JSON.stringify(fake.env)}\n`);
process.on('SIGTERM', () => void fake.close().then(() => process.exit(0)));
