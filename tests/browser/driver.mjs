// A page driven by label like a medic would (screens.test.mjs, route.test.mjs): taps by touch
// (phone) or mouse (laptop), thumb scrolls to bring an item between the top and the navigation
// bar, numbers through the in-app keypad ("Key 4", "Key OK"), every tapped target checked to be
// at least 48 CSS px tall.
import assert from 'node:assert/strict';
import {join} from 'node:path';

import {LabelledPage, pause, screenshotDir} from './browser.mjs';

export const MIN_TARGET_CSS_PX = 48;  // issue 4: ≥ 48 CSS px (≥ 9 mm) at any device pixel ratio
export const NAV = ['Here', 'Casualty', 'Curve', 'Bag', 'Oxygen', 'Route', 'AMS', 'Record', 'Teaching',
                    'Team', 'Settings'];  // core/ui/app_state.hpp kScreenNames: always in view

// What the keypad shows after these keys (< is backspace; - toggles the sign, wherever pressed).
export function keypadText(keys) {
  let text = '';
  for (const k of keys) {
    if (k === '<') text = text.slice(0, -1);
    else if (k === '-') text = text.startsWith('-') ? text.slice(1) : `-${text}`;
    else text += k;
  }
  return text;
}

// Drives one page by label, by touch (phone) or mouse (laptop).
export class Driver extends LabelledPage {
  constructor(name, page, touch) {
    super(page, name);
    Object.assign(this, {touch, taps: 0, smallest: Infinity});
  }

  // Scrolls the column under `x` by `dy` CSS px (positive: content moves up).
  async scroll(x, y, dy) {
    if (!this.touch) {
      await this.page.mouse.move(x, y);
      await this.page.mouse.wheel(0, dy);
      await this.framesPass(2);
      return;
    }
    // A thumb drag: touch events through CDP (page.touchscreen only taps); the page shell turns
    // them into mouse events and the app drags the page.
    const cdp = this.cdp ??= await this.page.context().newCDPSession(this.page);
    // A quick drag: the page follows the finger to where it lifts (no fling), so four moves
    // reach as far as many; slow drags over controls are touch.test.mjs's subject.
    const steps = 4;
    const point = (k) => [{x, y: y - (dy * k) / steps}];
    await cdp.send('Input.dispatchTouchEvent', {type: 'touchStart', touchPoints: point(0)});
    for (let k = 1; k <= steps; ++k) {
      await pause(16);
      await cdp.send('Input.dispatchTouchEvent', {type: 'touchMove', touchPoints: point(k)});
    }
    await cdp.send('Input.dispatchTouchEvent', {type: 'touchEnd', touchPoints: []});
    await this.framesPass(3);
  }

  // Brings a labelled item fully between the top of the screen and the navigation bar.
  async reveal(label) {
    // The keypad and the navigation bar are always in view.
    if (/^(Key|Unit) /.test(label) || NAV.includes(label)) return this.item(label);
    for (let attempt = 0; attempt < 24; ++attempt) {  // the Route screen is ~5 screens tall
      const target = await this.item(label);
      const bottom = await this.navBottom();
      if (target.y >= 0 && target.y + target.h <= bottom) return target;
      const centre = bottom / 2;
      const wanted = target.y + target.h / 2 - centre;
      // Up to 70 % of the view per drag (the page has no fling: it moves as far as the thumb).
      const dy = Math.sign(wanted) * Math.min(Math.abs(wanted), bottom * 0.7);
      const x = target.x + Math.min(target.w / 2, 40);
      // Drag from a point in the same column, clear of the item itself.
      await this.scroll(x, dy > 0 ? bottom * 0.85 : bottom * 0.15, dy);
    }
    assert.fail(`${this.name}: could not scroll "${label}" into view`);
  }

  // `settle: false` skips waiting for frames after a touch: the page shell queues touch-made
  // button events itself, one per frame, so keys on the (fixed) keypad can be tapped briskly.
  async tap(label, {settle = true} = {}) {
    const target = await this.reveal(label);
    this.taps += 1;
    this.smallest = Math.min(this.smallest, target.h);
    assert.ok(target.h >= MIN_TARGET_CSS_PX - 0.05,
              `${this.name}: "${label}" is ${target.h.toFixed(1)} CSS px tall (< ${MIN_TARGET_CSS_PX})`);
    const x = target.x + target.w / 2;
    const y = target.y + target.h / 2;
    // Nothing of the page may sit over the canvas where we tap (a notice over the keypad once
    // swallowed taps). A notice's own button is dismissed first, as a user would.
    const over = await this.page.evaluate(([px, py]) => {
      const element = document.elementFromPoint(px, py);
      if (!element || element.id === 'canvas') return null;
      const button = element.closest('#offline-note') && element.closest('button');
      return {what: element.closest('[id]')?.id ?? element.tagName, button: !!button};
    }, [x, y]);
    if (over?.button) {
      console.log(`${this.name}: dismissing the ${over.what} over "${label}"`);
      await this.page.evaluate(() => document.querySelector('#offline-note button:last-child')?.click());
      await pause(100);
    } else {
      assert.equal(over, null, `${this.name}: "${label}" is covered by ${JSON.stringify(over)}`);
    }
    if (this.touch) {
      // The page shell holds each touch-made button event until a frame has seen the last.
      await this.page.touchscreen.tap(x, y);
    } else {
      // A mouse is held until a frame has seen the press: ImGui 1.86 loses a press and release
      // inside one frame, and software-rendered frames here can take longer than a click. The
      // move and the press may share a frame (the press is where the pointer is in it); the
      // release needs a frame of its own before the next press, and keys need no more.
      await this.page.mouse.move(x, y);
      await this.page.mouse.down();
      await this.framesPass(1);
      await this.page.mouse.up();
      await this.framesPass(settle ? 2 : 1);
      return;
    }
    if (settle) await this.framesPass(2);
  }

  async screen(name) {
    await this.tap(name);
    await this.waitText(name, (t) => t === 'selected');
  }

  // Opens the field's keypad, optionally picks the unit on it, types `digits`, checks the
  // keypad shows them, presses OK and waits until the keypad is gone.
  async enter(field, digits, {unit} = {}) {
    await this.tap(field);
    await this.item('Keypad value');
    if (unit) await this.tap(`Unit ${unit}`);
    for (const c of digits) await this.tap(c === '<' ? 'Key Backspace' : `Key ${c}`, {settle: false});
    await this.waitText('Keypad value', (t) => t.split(' ')[0] === keypadText(digits));
    await this.tap('Key OK');
    const end = Date.now() + 3000;
    while (await this.find('Keypad value')) {
      assert.ok(Date.now() < end, `${this.name}: keypad still open after OK on "${field}"`);
      await pause(50);
    }
    await pause(100);
  }

  async shot(name) {
    const file = join(screenshotDir(), `${this.name}-${name}.png`);
    await this.page.screenshot({path: file});
    return file;
  }

  // The caution line with "Read more" is reachable (scrolled to) and opens the full text.
  // On the phone checked on the longest screens only.
  async cautionReachable(screen) {
    if (this.touch && !['Here', 'Oxygen'].includes(screen)) return;
    await this.tap('Read more');
    await this.item('Read less');
    await this.tap('Read less');
    await this.item('Read more');
  }
}
