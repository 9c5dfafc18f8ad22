import { useRegisterSW } from 'virtual:pwa-register/react';
import { UploadIcon } from '@/components/icons';

const CHECK_EVERY_MS = 30 * 60_000;

/**
 * The service worker keeps the kiosk on the tablet; a newer build is downloaded in the background and
 * waits here until someone taps to switch, so nobody is thrown out in the middle of a punch.
 */
export function UpdatePrompt() {
  const {
    needRefresh: [needRefresh, setNeedRefresh],
    updateServiceWorker,
  } = useRegisterSW({
    onRegisteredSW(_url, registration) {
      if (registration) setInterval(() => void registration.update().catch(() => undefined), CHECK_EVERY_MS);
    },
  });
  if (!needRefresh) return null;
  return (
    <div className="bt-outbox bt-update" role="status">
      <UploadIcon className="bt-outbox__icon" />
      <div className="bt-outbox__words">
        <strong>A new version of the kiosk is ready</strong>
        <span>
          Punches waiting on this tablet are kept. Switch when nobody is in the middle of something.
        </span>
      </div>
      <button type="button" className="bt-banner-button" onClick={() => void updateServiceWorker(true)}>
        Update now
      </button>
      <button type="button" className="bt-banner-button" onClick={() => setNeedRefresh(false)}>
        Later
      </button>
    </div>
  );
}
