'use server';

import { revalidatePath } from 'next/cache';
import { memberAction } from '@/server/action';
import { settingsFormSchema } from '../schemas';
import { updateShopSettings } from '../server/settings';

/** The Settings page's save: a lead only; every page reads the settings, so all are refreshed. */
export const saveSettings = memberAction(
  { permission: 'shop.settings', schema: settingsFormSchema },
  async (input, member) => {
    const saved = await updateShopSettings(member, input);
    revalidatePath('/', 'layout');
    return saved;
  },
);
