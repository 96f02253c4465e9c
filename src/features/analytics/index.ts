// The analytics feature's public surface for other screens (the dashboards themselves are route modules).
export { EpisodeTrajectoryChart } from './components/episode-trajectory-chart';
export { useFilterParams, filterQueryString } from './filters';
