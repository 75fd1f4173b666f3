import { rmSync } from 'node:fs';
import { clusterUrl, recreateDatabase, startCluster } from '@/db/cluster';
import { migrateDatabase } from '@/db/migrate';
import { startMailSink } from '@/server/dev/mail-sink';
import { installQueues } from '@/server/queue/boss';
import { INTEGRATION_SINK, TEMPLATE_DB } from './test-services';

/** Once per run: the cluster, a freshly migrated template database, and the mail sink. */
export default async function setup() {
  await startCluster();
  await recreateDatabase(TEMPLATE_DB);
  await migrateDatabase(clusterUrl(TEMPLATE_DB));
  // pg-boss's schema and queues in the template: each file's copy starts its queue at once.
  await installQueues(clusterUrl(TEMPLATE_DB));
  rmSync(INTEGRATION_SINK.dir, { recursive: true, force: true });
  const sink = await startMailSink(INTEGRATION_SINK);
  return async () => sink.close();
}
