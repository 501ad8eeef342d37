import { calendarFeedResponseSchema, type CalendarFeed } from '../../shared/schemas/watch';
import { request } from './client';

/** GET /api/calendar/feed: the signed-in user's secret calendar feed address. */
export async function getCalendarFeed(): Promise<CalendarFeed> {
  return (await request('GET', '/calendar/feed', { schema: calendarFeedResponseSchema })).feed;
}

/** POST /api/calendar/feed/rotate: a new secret; the old address stops working. */
export async function rotateCalendarFeed(): Promise<CalendarFeed> {
  return (await request('POST', '/calendar/feed/rotate', { schema: calendarFeedResponseSchema })).feed;
}
