import { createBrowserRouter } from 'react-router-dom';
import { routes } from '@/app/routes.tsx';

export const router = createBrowserRouter(routes);
