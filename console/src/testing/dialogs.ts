import { HarnessLoader } from '@angular/cdk/testing';
import { TestbedHarnessEnvironment } from '@angular/cdk/testing/testbed';
import { Component, ComponentRef, Type, inject } from '@angular/core';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { MatDialog, MatDialogConfig, MatDialogRef } from '@angular/material/dialog';
import { MatDialogHarness } from '@angular/material/dialog/testing';

/** An empty page the dialogs open over, as they do in the console. */
@Component({ selector: 'iso-dialog-host', template: '' })
class DialogHost {
  readonly dialog = inject(MatDialog);
}

export interface OpenDialog<T, R> {
  ref: MatDialogRef<T, R>;
  fixture: ComponentFixture<DialogHost>;
  /** Harnesses inside the overlay (dialogs render outside the host element). */
  loader: HarnessLoader;
  dialog: MatDialogHarness;
  /** What `afterClosed()` gave the opener: `undefined` until the dialog closed, then `{ value }`. */
  closed: () => { value: R | undefined } | undefined;
  component: T;
  element: HTMLElement;
  /** Runs change detection and waits, for after a flushed HTTP answer (harness calls do this themselves). */
  settle: () => Promise<void>;
}

/** Opens a dialog through the real MatDialog, so what the opener receives is what the test reads. */
export async function openDialog<T, R = unknown>(
  component: Type<T>,
  config: MatDialogConfig = {},
): Promise<OpenDialog<T, R>> {
  const fixture = TestBed.createComponent(DialogHost);
  const ref = fixture.componentInstance.dialog.open<T, unknown, R>(component, config);
  let result: { value: R | undefined } | undefined;
  ref.afterClosed().subscribe((value) => (result = { value }));
  fixture.detectChanges();
  await fixture.whenStable();
  const loader = TestbedHarnessEnvironment.documentRootLoader(fixture);
  const dialog = await loader.getHarness(MatDialogHarness);
  const componentRef = (ref as unknown as { _containerInstance: unknown; componentRef: ComponentRef<T> })
    .componentRef;
  return {
    ref,
    fixture,
    loader,
    dialog,
    closed: () => result,
    component: ref.componentInstance,
    element: componentRef.location.nativeElement as HTMLElement,
    settle: async () => {
      fixture.detectChanges();
      await fixture.whenStable();
    },
  };
}
