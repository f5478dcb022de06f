// Wet fingers double-tap. After a tap that changes the make (Finish, Done, Log reading) the
// next button may appear under the same finger, so a second tap within a moment is ignored.

/** Returns a guard that allows one tap, then refuses taps for `ms` milliseconds. */
export function createTapGuard(ms = 700) {
  let last = -Infinity;
  return (now: number = Date.now()): boolean => {
    if (now - last < ms) return false;
    last = now;
    return true;
  };
}
