import { lazy, Suspense, type ComponentType, type LazyExoticComponent } from 'react';
import { BrowserRouter, Navigate, Route, Routes, useLocation } from 'react-router';
import { getSession } from '@/lib/session';
import { PageLoader, RequireSession, ScreenGate } from './guards';
import { homePathFor, screenByKey, SCREENS, type ScreenKey } from './navigation';
import { PageErrorBoundary } from './routes/page-error-boundary';

// React Router in declarative mode: the data router (createBrowserRouter) adds about
// 18 kB gzip that the sign-in page cannot afford within its 150 kB budget, and no screen
// uses loaders or actions (data comes through TanStack Query).

/** Code-splits a named export; every page is its own chunk. */
function page<M>(load: () => Promise<M>, pick: (m: M) => ComponentType): LazyExoticComponent<ComponentType> {
  return lazy(() => load().then((m) => ({ default: pick(m) })));
}

function Lazy({ page: Page }: { page: LazyExoticComponent<ComponentType> }) {
  return (
    <Suspense fallback={<PageLoader />}>
      <Page />
    </Suspense>
  );
}

const SignIn = page(
  () => import('./routes/sign-in'),
  (m) => m.SignInRoute,
);
const Invitation = page(
  () => import('./routes/invitation'),
  (m) => m.InvitationRoute,
);
const AppLayout = page(
  () => import('./routes/app/layout'),
  (m) => m.AppLayout,
);
const NotFound = page(
  () => import('./routes/app/not-found'),
  (m) => m.NotFoundRoute,
);

/** One page per navigation entry. */
const SCREEN_PAGES: Record<ScreenKey, LazyExoticComponent<ComponentType>> = {
  board: page(
    () => import('./routes/app/board'),
    (m) => m.BoardRoute,
  ),
  'house-parts': page(
    () => import('./routes/app/house-parts'),
    (m) => m.HousePartsRoute,
  ),
  'vendor-parts': page(
    () => import('./routes/app/vendor-parts'),
    (m) => m.VendorPartsRoute,
  ),
  qualifications: page(
    () => import('./routes/app/qualifications'),
    (m) => m.QualificationsRoute,
  ),
  find: page(
    () => import('./routes/app/find'),
    (m) => m.FindPartsRoute,
  ),
  sources: page(
    () => import('./routes/app/sources'),
    (m) => m.SourcesRoute,
  ),
  outbox: page(
    () => import('./routes/app/outbox'),
    (m) => m.OutboxRoute,
  ),
  users: page(
    () => import('./routes/app/users'),
    (m) => m.UsersRoute,
  ),
};

/** Pages below a screen (one record, an upload, an import); the screen's roles apply to them. */
const CATALOGUE_PAGES: ReadonlyArray<{ screen: ScreenKey; path: string; page: LazyExoticComponent<ComponentType> }> = [
  {
    screen: 'house-parts',
    path: '/house-parts/:id',
    page: page(
      () => import('./routes/app/house-part'),
      (m) => m.HousePartRoute,
    ),
  },
  {
    screen: 'vendor-parts',
    path: '/vendor-parts/upload',
    page: page(
      () => import('./routes/app/vendor-parts-upload'),
      (m) => m.VendorPartsUploadRoute,
    ),
  },
  {
    screen: 'vendor-parts',
    path: '/vendor-parts/import',
    page: page(
      () => import('./routes/app/vendor-parts-import'),
      (m) => m.VendorPartsImportRoute,
    ),
  },
  {
    screen: 'vendor-parts',
    path: '/vendor-parts/:id',
    page: page(
      () => import('./routes/app/vendor-part'),
      (m) => m.VendorPartRoute,
    ),
  },
  {
    screen: 'qualifications',
    path: '/qualifications/:id',
    page: page(
      () => import('./routes/app/qualification'),
      (m) => m.QualificationRoute,
    ),
  },
  {
    screen: 'board',
    path: '/compare/:housePartId',
    page: page(
      () => import('./routes/app/compare'),
      (m) => m.CompareRoute,
    ),
  },
];

function HomeRedirect() {
  const session = getSession();
  return <Navigate to={session ? homePathFor(session.user.role) : '/sign-in'} replace />;
}

/** Every route of the app; tests mount it inside a MemoryRouter. */
export function AppRoutes() {
  const location = useLocation();
  return (
    // Reset by path so a page that failed does not keep the next one from showing.
    <PageErrorBoundary resetKey={location.pathname}>
      <Routes>
        <Route path="/sign-in" element={<Lazy page={SignIn} />} />
        <Route path="/invitation/:token" element={<Lazy page={Invitation} />} />
        <Route element={<RequireSession />}>
          <Route element={<Lazy page={AppLayout} />}>
            <Route index element={<HomeRedirect />} />
            {SCREENS.map((screen) => (
              <Route key={screen.key} path={screen.path} element={<ScreenGate screen={screen} page={SCREEN_PAGES[screen.key]} />} />
            ))}
            {CATALOGUE_PAGES.map((sub) => (
              <Route key={sub.path} path={sub.path} element={<ScreenGate screen={screenByKey(sub.screen)} page={sub.page} />} />
            ))}
            <Route path="*" element={<Lazy page={NotFound} />} />
          </Route>
        </Route>
      </Routes>
    </PageErrorBoundary>
  );
}

export function AppRouter() {
  return (
    <BrowserRouter>
      <AppRoutes />
    </BrowserRouter>
  );
}
