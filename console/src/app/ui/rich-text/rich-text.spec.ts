import { TestBed } from '@angular/core/testing';
import { RichText } from './rich-text';

describe('RichText', () => {
  function render(text: string): HTMLElement {
    const fixture = TestBed.createComponent(RichText);
    fixture.componentRef.setInput('text', text);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('shows a description’s inline markup as elements', () => {
    const element = render(
      'Send `sampleRateHz` as **hertz**, see *the cookbook* and [limits](/docs/#/limits) for more.',
    );
    expect(element.querySelector('code')?.textContent).toBe('sampleRateHz');
    expect(element.querySelector('strong')?.textContent).toBe('hertz');
    expect(element.querySelector('em')?.textContent).toBe('the cookbook');
    const link = element.querySelector('a');
    expect(link?.textContent).toBe('limits');
    expect(link?.getAttribute('href')).toBe('/docs/#/limits');
    // No space is added around the elements: "**hertz**," reads "hertz,", not "hertz ,".
    expect(element.textContent).toBe('Send sampleRateHz as hertz, see the cookbook and limits for more.');
  });

  it('never renders markup from the text, nor a link to a script', () => {
    const element = render('<img src=x onerror="alert(1)"> and [click](javascript:alert(1))');
    expect(element.querySelector('img')).toBeNull();
    expect(element.querySelector('a')).toBeNull();
    expect(element.textContent).toContain('<img src=x onerror="alert(1)"> and click');
  });
});
