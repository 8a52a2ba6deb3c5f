import { createBrowserRouter, Link } from 'react-router-dom';
import { HomeRoute } from './routes/home-route';
import { ReviewRoute } from './routes/review-route';
import { SignInRoute } from './routes/sign-in-route';
import { StaffRoute } from './routes/staff-route';
import { TodayRoute } from './routes/today-route';

function NotFound() {
  return (
    <main className="p-6">
      <h1 className="text-2xl font-semibold">Page not found</h1>
      <Link className="mt-4 inline-block underline" to="/">
        Go to your home screen
      </Link>
    </main>
  );
}

export const routes = [
  { path: '/', element: <HomeRoute /> },
  { path: '/sign-in', element: <SignInRoute /> },
  { path: '/today', element: <TodayRoute /> },
  { path: '/review', element: <ReviewRoute /> },
  { path: '/staff', element: <StaffRoute /> },
  { path: '*', element: <NotFound /> },
];

export const createAppRouter = () => createBrowserRouter(routes);
