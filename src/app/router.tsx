import { createBrowserRouter, Link } from 'react-router-dom';
import { AthleteRoute } from './routes/athlete-route';
import { AthletesRoute } from './routes/athletes-route';
import { HomeRoute } from './routes/home-route';
import { InjuryRoute } from './routes/injury-route';
import { ReviewRoute } from './routes/review-route';
import { ReviewRunRoute } from './routes/review-run-route';
import { SequencesRoute } from './routes/sequences-route';
import { SignInRoute } from './routes/sign-in-route';
import { StaffRoute } from './routes/staff-route';
import { TodayRoute } from './routes/today-route';
import { RunSummaryRoute } from './routes/run-summary-route';
import { ScreeningRoute } from './routes/screening-route';
import { StartRunRoute } from './routes/start-run-route';
import { TableRoute } from './routes/table-route';
import { ForgotPasswordRoute } from './routes/forgot-password-route';
import { MailboxRoute } from './routes/mailbox-route';
import { SetPasswordRoute } from './routes/set-password-route';
import { SettingsRoute } from './routes/settings-route';
import { AuditRoute } from './routes/audit-route';
import { ReferralRoute } from './routes/referral-route';
import { DataRightsRoute } from './routes/data-rights-route';
import { OptOutRoute } from './routes/opt-out-route';

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
  { path: '/forgot-password', element: <ForgotPasswordRoute /> },
  { path: '/set-password', element: <SetPasswordRoute /> },
  { path: '/mailbox', element: <MailboxRoute /> },
  { path: '/today', element: <TodayRoute /> },
  { path: '/athletes', element: <AthletesRoute /> },
  { path: '/athletes/:id', element: <AthleteRoute /> },
  { path: '/injuries/:id', element: <InjuryRoute /> },
  { path: '/injuries/:id/referral', element: <ReferralRoute /> },
  { path: '/review', element: <ReviewRoute /> },
  { path: '/review/runs/:id', element: <ReviewRunRoute /> },
  { path: '/sequences', element: <SequencesRoute /> },
  { path: '/staff', element: <StaffRoute /> },
  { path: '/settings', element: <SettingsRoute /> },
  { path: '/audit', element: <AuditRoute /> },
  { path: '/data-rights', element: <DataRightsRoute /> },
  { path: '/opt-out', element: <OptOutRoute /> },
  { path: '/runs/new', element: <StartRunRoute /> },
  { path: '/runs/:id/screening', element: <ScreeningRoute /> },
  { path: '/runs/:id/summary', element: <RunSummaryRoute /> },
  { path: '/table/:runId', element: <TableRoute /> },
  { path: '*', element: <NotFound /> },
];

export const createAppRouter = () => createBrowserRouter(routes);
