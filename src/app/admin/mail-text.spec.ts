import { framedMailHtml, hasInlineImages, splitMailText } from './mail-text';

describe('splitMailText', () => {
  it('turns web addresses into links and leaves the prose around them, without the closing full stop', () => {
    expect(splitMailText('Open https://club.example/accept-invite?token=a1b2. It works 7 days.')).toEqual([
      { kind: 'text', value: 'Open ' },
      { kind: 'link', value: 'https://club.example/accept-invite?token=a1b2' },
      { kind: 'text', value: '. It works 7 days.' },
    ]);
  });

  it('keeps text without addresses whole, and ignores non-web schemes', () => {
    expect(splitMailText('No link here; javascript:alert(1) stays text')).toEqual([
      { kind: 'text', value: 'No link here; javascript:alert(1) stays text' },
    ]);
  });
});

describe('framedMailHtml', () => {
  it('blocks remote loads and keeps links from navigating the frame', () => {
    const framed = framedMailHtml('<p>Hi</p>');
    expect(framed).toContain(`content="default-src 'none'; img-src data:; style-src 'unsafe-inline'"`);
    expect(framed).toContain('<base target="_blank">');
    expect(framed).toContain('<body><p>Hi</p></body>');
  });
});

describe('hasInlineImages', () => {
  it('spots cid: images only', () => {
    expect(hasInlineImages('<img src="cid:week-chart@loftline" alt="chart">')).toBeTrue();
    expect(hasInlineImages('<img src="data:image/png;base64,AAAA">')).toBeFalse();
    expect(hasInlineImages('<p>cid: is mentioned in prose</p>')).toBeFalse();
  });
});
