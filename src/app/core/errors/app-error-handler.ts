import { ErrorHandler, Injectable, inject, NgZone } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

/**
 * Unexpected errors end here: logged, and shown once in a snack bar. A failed lazy chunk
 * (after a deployment) offers a reload, the only fix for it.
 */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  private readonly snackBar = inject(MatSnackBar);
  private readonly zone = inject(NgZone);

  handleError(error: unknown): void {
    console.error(error);
    const message = error instanceof Error ? error.message : String(error);
    const isChunkError = /Loading chunk|dynamically imported module|Failed to fetch dynamically/i.test(message);
    this.zone.run(() => {
      const ref = this.snackBar.open(
        isChunkError ? 'A newer version of Torquetrail is available.' : 'Something went wrong on this page; it has been logged.',
        isChunkError ? 'Reload' : 'Dismiss',
        { duration: isChunkError ? undefined : 8000 },
      );
      if (isChunkError) ref.onAction().subscribe(() => location.reload());
    });
  }
}
