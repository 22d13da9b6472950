import { useState } from 'react';
import { createBrowserRouter, RouterProvider } from 'react-router-dom';
import { AppProvider } from './provider';
import { createRoutes } from './router';

/** The whole client: providers around the router. */
export function App() {
  const [router] = useState(() => createBrowserRouter(createRoutes()));
  return (
    <AppProvider>
      <RouterProvider router={router} />
    </AppProvider>
  );
}
