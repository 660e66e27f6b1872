import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { provideHttpClient } from '@angular/common/http';
import { provideHttpClientTesting } from '@angular/common/http/testing';
import { provideZonelessChangeDetection } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatButtonHarness } from '@angular/material/button/testing';
import { MatButtonToggleHarness } from '@angular/material/button-toggle/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { provideRouter } from '@angular/router';
import { BROWSER_STORAGE } from '../core/browser-storage';
import { KickStore } from '../core/kick-store';
import { LOFTLINE_DB, type LoftlineDb } from '../core/loftline-db';
import { SessionStore } from '../core/session-store';
import { SPEC_COACH, SPEC_IDS, freshDb, signedInStorage, until } from '../core/spec-support';
import { spinWords, videoPixelAt } from './frame-geometry';
import { VideoMeasure } from './video-measure';

describe('videoPixelAt (object-fit: contain)', () => {
  it('undoes the bars above and below a wide frame in a tall box', () => {
    // A 1920×1080 frame in a 400×400 box: scale 400/1920, frame 225 px high, bars of 87.5 px above and below.
    const box = { left: 10, top: 20, width: 400, height: 400 };
    expect(videoPixelAt(box, 1920, 1080, 10 + 200, 20 + 200)).toEqual({ xPx: 960, yPx: 540 });
    const corner = videoPixelAt(box, 1920, 1080, 10, 20 + 87.5)!;
    expect(corner.xPx).toBeCloseTo(0, 9);
    expect(corner.yPx).toBeCloseTo(0, 9);
    expect(videoPixelAt(box, 1920, 1080, 210, 30)).toBeNull();
  });

  it('undoes the bars left and right of a tall frame, and 375 px on screen is 750 px of a frame shown at half size', () => {
    const box = { left: 0, top: 0, width: 1000, height: 360 };
    // 720×1280 portrait frame: scale 360/1280, shown 202.5 px wide, centred.
    const left = videoPixelAt(box, 720, 1280, (1000 - 202.5) / 2, 0)!;
    expect(left.xPx).toBeCloseTo(0, 9);
    const half = { left: 0, top: 0, width: 640, height: 360 };
    const a = videoPixelAt(half, 1280, 720, 50, 300)!;
    const b = videoPixelAt(half, 1280, 720, 425, 300)!;
    expect(b.xPx - a.xPx).toBeCloseTo(750, 9);
  });

  it('says spin in a coach’s words', () => {
    expect(spinWords(4.24, 0.81)).toBe('backspin 4.2 ± 0.8 rev/s');
    expect(spinWords(-3, 1)).toBe('topspin 3.0 ± 1.0 rev/s');
    expect(spinWords(0.2, 2)).toBe('no clear spin (0.2 ± 2.0 rev/s)');
  });
});

describe('VideoMeasure (real IndexedDB)', () => {
  let db: LoftlineDb;
  let fixture: ComponentFixture<VideoMeasure>;
  let loader: HarnessLoader;
  let kickId: string;

  beforeEach(async () => {
    db = freshDb();
    TestBed.configureTestingModule({
      imports: [VideoMeasure],
      providers: [
        provideZonelessChangeDetection(),
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: BROWSER_STORAGE, useValue: signedInStorage(SPEC_COACH) },
        { provide: LOFTLINE_DB, useValue: db },
      ],
    });
    const sessions = TestBed.inject(SessionStore);
    const session = await sessions.start({ squadId: SPEC_IDS.squad, ballSize: 5, temperatureC: 11 });
    const drill = await sessions.addDrill(session.id, { technique: 'lofted', targetDistanceM: 32, targetRadiusM: 3 });
    kickId = (
      await TestBed.inject(KickStore).log({
        sessionId: session.id,
        drillId: drill.id,
        playerId: SPEC_IDS.playerA,
        technique: 'lofted',
        foot: 'right',
        backspinStep: 1,
        sidespinStep: 0,
        targetDistanceM: 32,
        targetRadiusM: 3,
        outcome: 'short',
      })
    ).id;
    fixture = TestBed.createComponent(VideoMeasure);
    loader = TestbedHarnessEnvironment.loader(fixture);
  });

  afterEach(async () => {
    TestBed.resetTestingModule();
    await db.delete();
  });

  const text = () => (fixture.nativeElement as HTMLElement).textContent ?? '';

  it('says when the repetition is not on this phone', async () => {
    fixture.componentRef.setInput('kickId', '00000000-0000-4000-8000-000000000000');
    await until('the missing note', () => (fixture.detectChanges(), text().includes('not on this phone')));
  });

  it('promises the clip stays on the phone and offers a video picker that can film', async () => {
    fixture.componentRef.setInput('kickId', kickId);
    await until('the kick', () => (fixture.detectChanges(), text().includes('The video stays on this phone')));
    const picker = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('input[type=file]')!;
    expect(picker.accept).toBe('video/*');
    expect(picker.getAttribute('capture')).toBe('environment');
    expect(await loader.getAllHarnesses(MatButtonHarness.with({ text: 'Measure the launch' }))).toEqual([]);
  });

  it('marks the kick spot, then the second point, from the keyboard, with the drill’s target as its distance', async () => {
    fixture.componentRef.setInput('kickId', kickId);
    await until('the kick', () => (fixture.detectChanges(), text().includes('The video stays on this phone')));
    const picker = (fixture.nativeElement as HTMLElement).querySelector<HTMLInputElement>('input[type=file]')!;
    const files = new DataTransfer();
    files.items.add(new File([new Uint8Array(16)], 'kick.webm', { type: 'video/webm' }));
    picker.files = files.files;
    picker.dispatchEvent(new Event('change'));
    await fixture.whenStable();

    const target = async (label: string) => (await loader.getHarness(MatButtonToggleHarness.with({ text: label }))).isChecked();
    expect(await target('Kick spot')).toBeTrue();
    const field = await loader.getHarness(MatFormFieldHarness.with({ floatingLabelText: 'Second point distance (m)' }));
    const far = (await field.getControl(MatInputHarness))!;
    await until('the drill’s target as the far distance', async () => (await far.getValue()) === '32');
    const measure = await loader.getHarness(MatButtonHarness.with({ text: 'Measure the launch' }));
    expect(await measure.isDisabled()).toBeTrue();

    const overlay = (fixture.nativeElement as HTMLElement).querySelector<SVGElement>('[data-testid=frame-overlay]')!;
    expect(overlay.getAttribute('aria-label')).toContain('arrow keys');
    overlay.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
    await fixture.whenStable();
    expect(await target('Second ground point')).toBeTrue();
    overlay.dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', shiftKey: true, bubbles: true }));
    overlay.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
    await fixture.whenStable();
    expect(await target('Ball')).toBeTrue();
    expect(await measure.isDisabled()).toBeTrue();
  });

  it('records a topspin measurement with the video source, turning a logged backspin step to topspin', async () => {
    const store = TestBed.inject(KickStore);
    const track = {
      frameWidthPx: 1280,
      frameHeightPx: 720,
      points: [0.1, 0.2, 0.3, 0.4, 0.5].map((tS, i) => ({ tS, xPx: 100 + 50 * i, yPx: 500 - 20 * i })),
      calibration: { a: { xPx: 90, yPx: 600, alongM: 0 }, b: { xPx: 840, yPx: 600, alongM: 30 } },
      backspinRps: -5.5,
      contactTimeS: 0.05,
      rmsResidualPx: 1,
      uncertainty: { speedMs: 0.2, elevationDeg: 0.3, backspinRps: 0.9 },
    };
    const saved = await store.recordVideoMeasurement(kickId, { speedMs: 22.4, elevationDeg: 18.2, videoTrack: track });
    expect(saved.measuredSource).toBe('video');
    expect(saved.measuredSpinRps).toBe(5.5);
    // 5.5 rev/s is nearest the topspin step's 6 rev/s (docs/design.md §6 defaults).
    expect(saved.backspinStep).toBe(-2);
    const queued = await db.outbox.where('entityId').equals(kickId).toArray();
    expect(queued.some((m) => m.data['measuredSource'] === 'video' && m.data['videoTrack'] !== undefined)).toBeTrue();
  });
});
