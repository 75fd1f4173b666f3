import { redirect } from 'next/navigation';
import { homePathFor } from '@/server/auth/return-path';
import { getCurrentMember } from '@/server/auth/session';

export default async function Home() {
  const member = await getCurrentMember();
  redirect(member ? homePathFor(member.role) : '/sign-in');
}
