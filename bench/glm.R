# Section 4b of `npm run bench` (bench/logistic.ts): times R's glm on the benchmark's logistic
# regression. Reads the columns written by the benchmark (little-endian doubles, column after
# column: y, x1..x10), fits glm(y ~ ., binomial) `repeats` times, prints one JSON line with the
# median CPU time (user + system, as the benchmark measures its own side) and elapsed time, the
# coefficients and the deviance.
# Usage: Rscript bench/glm.R <file> <rows> <repeats>
args <- commandArgs(trailingOnly = TRUE)
path <- args[1]
n <- as.integer(args[2])
repeats <- as.integer(args[3])
con <- file(path, "rb")
values <- readBin(con, what = "double", n = 11 * n, size = 8, endian = "little")
close(con)
d <- as.data.frame(matrix(values, nrow = n, ncol = 11))
names(d) <- c("y", paste0("x", 1:10))
rm(values)
times <- numeric(repeats)
elapsed <- numeric(repeats)
for (i in seq_len(repeats)) {
  t <- system.time(fit <- glm(y ~ ., family = binomial(), data = d))
  times[i] <- t[["user.self"]] + t[["sys.self"]]
  elapsed[i] <- t[["elapsed"]]
}
cf <- coef(fit)
cat(sprintf('{"r":"%s","seconds":%.6f,"elapsed":%.6f,"iterations":%d,"deviance":%.10g,"coefficients":[%s]}\n',
  R.version.string, median(times), median(elapsed), fit$iter, deviance(fit),
  paste(sprintf("%.12g", cf), collapse = ",")))
