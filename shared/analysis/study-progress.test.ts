import { describe, expect, it } from 'vitest';
import { catchmentStatus, cellStatusOf, studyStatus } from './study-progress';

describe('study progress', () => {
  it('shows a queued run as waiting and a cell that could not start as failed', () => {
    expect(cellStatusOf('queued', null)).toBe('waiting');
    expect(cellStatusOf(null, 'No temperature series covers the period.')).toBe('failed');
    expect(cellStatusOf(null, null)).toBe('waiting');
  });

  it('calls a catchment failed (with the message) before running, waiting, cancelled and done', () => {
    const done = { status: 'done' as const, progress: 1, message: null };
    expect(catchmentStatus([done, { status: 'failed', progress: 0, message: 'gap' }, { status: 'running', progress: 0.5, message: null }]))
      .toEqual({ status: 'failed', message: 'gap', progress: 0.5 });
    expect(catchmentStatus([done, { status: 'running', progress: 0.5, message: null }])).toMatchObject({ status: 'running', progress: 0.75 });
    expect(catchmentStatus([done, done])).toEqual({ status: 'done', message: null, progress: 1 });
  });

  it('is a draft until started, waiting until something moves, then running until every catchment has ended', () => {
    expect(studyStatus(false, ['waiting'])).toBe('draft');
    expect(studyStatus(true, ['waiting', 'waiting'])).toBe('waiting');
    expect(studyStatus(true, ['done', 'waiting'])).toBe('running');
    expect(studyStatus(true, ['done', 'failed'])).toBe('failed');
    expect(studyStatus(true, ['done', 'cancelled'])).toBe('cancelled');
    expect(studyStatus(true, ['done', 'done'])).toBe('done');
  });
});
