import { LoadingView } from "@/components/layout/loading-view";

export default LoadingView;
