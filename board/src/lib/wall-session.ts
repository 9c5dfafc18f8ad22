import { wallToken } from './token-store';

const REFUSED_KEY = 'baytime.wall.refused';

/** The server refused this screen's token: forget it and remember to say why on the pairing page. */
export function forgetWallToken(): void {
  try {
    sessionStorage.setItem(REFUSED_KEY, '1');
  } catch {
    // the pairing page then simply shows no reason
  }
  wallToken.clear();
}

/** True once after a refusal. */
export function takeRefusedNotice(): boolean {
  try {
    const refused = sessionStorage.getItem(REFUSED_KEY) === '1';
    sessionStorage.removeItem(REFUSED_KEY);
    return refused;
  } catch {
    return false;
  }
}
