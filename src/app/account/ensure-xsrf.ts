import type { HttpClient } from '@angular/common/http';
import { firstValueFrom } from 'rxjs';

/** The server sets XSRF-TOKEN on any GET; signed-out pages make sure one happened before their first write. */
export async function ensureXsrfCookie(http: HttpClient): Promise<void> {
  if (!document.cookie.includes('XSRF-TOKEN=')) await firstValueFrom(http.get('/api/health')).catch(() => undefined);
}
