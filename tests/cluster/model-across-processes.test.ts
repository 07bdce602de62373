// The model-based gate test (tests/api/bookings/model-based.test.ts) run against the cluster:
// its requests go through the proxy to both app processes, whose connections spread over the
// three nodes; its checks read node1. MODEL_SEED / MODEL_ROUNDS work as there.
import { nodeInstances, testCluster } from '../../scripts/lib/galera';
import { startTestCluster, type ClusterContext } from './cluster-helpers';

const DATABASE = 'voltcrib_cluster_model';
const layout = testCluster();
process.env.MODEL_TARGET_URL = `http://127.0.0.1:${layout.proxy}`;
process.env.MODEL_TARGET_DB_SOCKET = nodeInstances(layout)[0]!.socket;
process.env.MODEL_TARGET_DB_NAME = DATABASE;
process.env.MODEL_ROUNDS ??= '20';

let ctx: ClusterContext;
beforeAll(async () => {
  ctx = await startTestCluster(DATABASE);
}, 600_000);
afterAll(() => ctx.close());

// Registers the model's hooks and test after the cluster's start above.
// eslint-disable-next-line @typescript-eslint/no-require-imports
require('../api/bookings/model-based.test');
