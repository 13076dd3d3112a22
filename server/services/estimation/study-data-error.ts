/** A study's answers cannot be turned into choice data (no answers, versions coded apart). */
import { AppError } from '../../lib/errors';

export class StudyDataError extends AppError {
  constructor(code: 'no_data' | 'versions_differ' | 'no_estimation_tasks', message: string) {
    super(422, code, message);
    this.name = 'StudyDataError';
  }
}
