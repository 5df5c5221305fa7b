# Section 4c of `npm run bench` (bench/data-scale.ts): R's whole process for what
# `causeway estimate` is compared with — read.csv of the demo study's CSV, then the crude and the
# planned-set logistic regressions of hypertension on cycling (glm, binomial). Prints one JSON
# line: the elapsed times of the two steps inside R and the planned odds ratio, so the benchmark
# can check that both programs estimate the same number.
# Usage: Rscript bench/data-glm.R <data.csv>
args <- commandArgs(trailingOnly = TRUE)
t0 <- proc.time()
d <- read.csv(args[1])
t1 <- proc.time()
crude <- glm(hypertension ~ cycling, family = binomial(), data = d)
planned <- glm(hypertension ~ cycling + age + income + diet, family = binomial(), data = d)
t2 <- proc.time()
cat(sprintf('{"rows":%d,"read":%.3f,"fits":%.3f,"crudeOR":%.10g,"plannedOR":%.10g}\n', nrow(d),
  (t1 - t0)[["elapsed"]], (t2 - t1)[["elapsed"]], exp(coef(crude)[["cycling"]]), exp(coef(planned)[["cycling"]])))
