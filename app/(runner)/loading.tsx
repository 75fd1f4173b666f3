import { RouteLoading } from '@/features/ui/route-loading';

export default function RunnerLoading() {
  return <RouteLoading what="wheel" />;
}
