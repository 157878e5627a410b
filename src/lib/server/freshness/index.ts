export { currentVersion, dataVersionColumn, touch } from './version';
export { keepableRoutes, keptAnswerHeader, markKeepableAnswers } from './handle';
export { openFrontDoor } from './front-door';
