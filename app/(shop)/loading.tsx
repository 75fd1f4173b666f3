import { RouteLoading } from '@/features/ui/route-loading';

export default function ShopLoading() {
  return <RouteLoading />;
}
