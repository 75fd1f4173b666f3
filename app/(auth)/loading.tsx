import { RouteLoading } from '@/features/ui/route-loading';

export default function AuthLoading() {
  return <RouteLoading />;
}
