import { getTestBed } from '@angular/core/testing';

/**
 * The builder runs spec files without isolation (one module graph per worker, as Karma did) and resets
 * TestBed after each test. A test whose own afterEach throws skips that reset, and every later test in
 * the worker would then fail with "already instantiated"; resetting before each test keeps one failure
 * one failure.
 */
beforeEach(() => getTestBed().resetTestingModule());
