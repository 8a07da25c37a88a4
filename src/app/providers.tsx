import { QueryClientProvider } from '@tanstack/react-query';
import { useEffect, useState, type ReactNode } from 'react';
import { setMe } from '../features/auth/api/get-me';
import { onUnauthenticated } from '../lib/api-client';
import { createQueryClient } from '../lib/query-client';

export function AppProviders({ children }: { children: ReactNode }) {
  const [queryClient] = useState(createQueryClient);
  // A 401 anywhere means the session ended: forget the user so the guards show sign-in.
  useEffect(
    () =>
      onUnauthenticated(() => {
        setMe(queryClient, null);
      }),
    [queryClient],
  );
  return <QueryClientProvider client={queryClient}>{children}</QueryClientProvider>;
}
