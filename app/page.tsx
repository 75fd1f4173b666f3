import { redirect } from 'next/navigation';
import { getCurrentMember } from '@/server/auth/session';

export default async function Home() {
  redirect((await getCurrentMember()) ? '/board' : '/sign-in');
}
