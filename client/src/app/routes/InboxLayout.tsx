import { Suspense } from 'react';
import { Outlet } from 'react-router';

export default function InboxLayout() {
  return (
    <>
      <h1 className="page-title">Inbox</h1>
      <Suspense fallback={null}>
        <Outlet />
      </Suspense>
    </>
  );
}
