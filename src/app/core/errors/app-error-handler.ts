import { ErrorHandler, Injectable, inject } from '@angular/core';
import { MatSnackBar } from '@angular/material/snack-bar';

/**
 * Unexpected errors end here: logged, and shown once in a snack bar. A failed lazy chunk
 * (after a deployment) offers a reload, the only fix for it. The app is zoneless, so the
 * snack bar is opened directly: signals and Material's own change detection show it.
 */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  private readonly snackBar = inject(MatSnackBar);

  handleError(error: unknown): void {
    console.error(error);
    const message = error instanceof Error ? error.message : String(error);
    const isChunkError = /Loading chunk|dynamically imported module|Failed to fetch dynamically/i.test(message);
    const ref = this.snackBar.open(
      isChunkError
        ? 'A newer version of Torquetrail is available.'
        : 'Something went wrong on this page; it has been logged.',
      isChunkError ? 'Reload' : 'Dismiss',
      { duration: isChunkError ? undefined : 8000 },
    );
    if (isChunkError) ref.onAction().subscribe(() => location.reload());
  }
}
