'use client';

import dynamic from 'next/dynamic';

// A split point on the client side: a page's client components are all fetched with the page,
// drawn or not, but a dynamic import inside one is fetched only when it is drawn. Advisors and
// coordinators get the panel rendered on the server (in the first paint); a farmer's phone never
// fetches it or its query client.
export const SendSection = dynamic(() => import('./send-panel'));
