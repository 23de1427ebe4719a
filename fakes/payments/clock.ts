// Wall-clock seconds plus an offset the tests can push forward, so expiry rules that
// need 30 minutes or more can be exercised without waiting.
export class FakeClock {
  constructor(public offsetSeconds = 0) {}

  now(): number {
    return Math.floor(Date.now() / 1000) + this.offsetSeconds;
  }

  advance(seconds: number): number {
    this.offsetSeconds += seconds;
    return this.now();
  }
}
