'use client';

import { RouteError, type RouteErrorProps } from '@/features/ui/route-error';

export default function GroupError(props: RouteErrorProps) {
  return <RouteError {...props} />;
}
