import { ComponentHarness, HarnessPredicate, type BaseHarnessFilters } from '@angular/cdk/testing';
import { MatFormFieldHarness } from '@angular/material/form-field/testing';
import { MatInputHarness } from '@angular/material/input/testing';
import { MatSliderHarness } from '@angular/material/slider/testing';

/** Filters for {@link SliderFieldHarness}. */
export interface SliderFieldHarnessFilters extends BaseHarnessFilters {
  /** The field's label, e.g. "Speed". */
  label?: string | RegExp;
}

/**
 * Test harness for `ll-slider-field`, built from Material's own harnesses, so specs drive the slider and
 * the number field the way a user does instead of poking at the DOM.
 */
export class SliderFieldHarness extends ComponentHarness {
  static hostSelector = 'll-slider-field';

  /** A predicate that finds a slider field by its label. */
  static with(options: SliderFieldHarnessFilters = {}): HarnessPredicate<SliderFieldHarness> {
    return new HarnessPredicate(SliderFieldHarness, options).addOption('label', options.label, (harness, label) =>
      HarnessPredicate.stringMatches(harness.getLabel(), label),
    );
  }

  private readonly formField = this.locatorFor(MatFormFieldHarness);
  private readonly number = this.locatorFor(MatInputHarness);
  private readonly slider = this.locatorFor(MatSliderHarness);

  /** The label text. */
  async getLabel(): Promise<string | null> {
    return (await this.formField()).getLabel();
  }

  /** Type a value into the number field (as text, so invalid input can be tried too). */
  async type(value: string): Promise<void> {
    const input = await this.number();
    await input.setValue(value);
    await input.blur();
  }

  /** Move the slider to a value. */
  async slide(value: number): Promise<void> {
    await (await (await this.slider()).getEndThumb()).setValue(value);
  }

  /** The number field's text. */
  async getTypedValue(): Promise<string> {
    return (await this.number()).getValue();
  }

  /** The slider's value. */
  async getSliderValue(): Promise<number> {
    return (await (await this.slider()).getEndThumb()).getValue();
  }

  /** The error under the number field, if any. */
  async getError(): Promise<string | null> {
    const errors = await (await this.formField()).getTextErrors();
    return errors[0] ?? null;
  }
}
