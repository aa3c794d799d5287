/** Department dates in words: shared with the API, whose notes write dates the same way. */
export { DAY_MONTH, DAY_MONTH_YEAR, formatDay, WEEKDAY_DAY, WEEKDAY_DAY_YEAR } from '@swardwise/domain';
