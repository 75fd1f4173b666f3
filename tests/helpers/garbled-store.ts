// The photo store's configuration as the report tests mock it: the real check, which while
// `withGarbledToken` runs is given a garbled UPLOADTHING_TOKEN and refuses it, as in a server.
// A test file mocks '@/server/storage/store-config' with `garbleable` (imported in the factory).
import type * as StoreConfigModule from '@/server/storage/store-config';

const token = { garbled: false };

export function garbleable(real: typeof StoreConfigModule): typeof StoreConfigModule {
  const storeConfig = () =>
    token.garbled ? real.storeConfigFrom({ UPLOADTHING_TOKEN: 'sk_live!' }) : real.storeConfig();
  return { ...real, storeConfig };
}

export async function withGarbledToken(run: () => Promise<void>) {
  token.garbled = true;
  try {
    await run();
  } finally {
    token.garbled = false;
  }
}
