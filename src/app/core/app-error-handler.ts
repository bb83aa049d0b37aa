import { HttpErrorResponse } from '@angular/common/http';
import { ErrorHandler, inject, Injectable } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';
import { messageOf } from './api-error';

/** Logs anything not handled where it happened and tells the user in a snack bar. */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  private readonly snackBar = inject(MatSnackBar);

  handleError(error: unknown): void {
    console.error(error);
    const message = error instanceof HttpErrorResponse ? messageOf(error) : 'Something went wrong; reload the page and try again';
    this.snackBar.open(message, 'Close', { duration: 6000 });
  }
}
