#include <gtest/gtest.h>

#include "plugin/batch/case_result.h"
#include "plugin/core/error.h"

namespace ergpath::batch {
namespace {

WorkResult result(double work, double error, double length, bool closed = false) {
  WorkResult r;
  r.work_J = work;
  r.error_J = error;
  r.length_m = length;
  r.closed = closed;
  r.fields = {{"spring", 0.25 * work}, {"weight", 0.75 * work}};
  r.peak.force_N = -12.0;
  return r;
}

const Check& only(const std::vector<Check>& checks) {
  EXPECT_EQ(checks.size(), 1u);
  return checks.front();
}

TEST(JudgeLimits, ValueWithinTheMaximumByMoreThanItsErrorPasses) {
  Limits l;
  l.work_max_J = 10.0;
  const Check c = only(judge_limits(l, result(9.0, 0.5, 1.0)));
  EXPECT_TRUE(c.pass);
  EXPECT_EQ(c.quantity, "work_J");
  EXPECT_EQ(c.bound, "max");
}

TEST(JudgeLimits, ValueUnderTheMaximumButWithinItsErrorFails) {
  Limits l;
  l.work_max_J = 10.0;
  EXPECT_FALSE(only(judge_limits(l, result(9.9, 0.2, 1.0))).pass);
}

TEST(JudgeLimits, MinimumIsJudgedOnValueMinusError) {
  Limits l;
  l.work_min_J = -5.0;
  EXPECT_TRUE(only(judge_limits(l, result(-4.0, 0.5, 1.0))).pass);
  EXPECT_FALSE(only(judge_limits(l, result(-4.9, 0.2, 1.0))).pass);
}

TEST(JudgeLimits, MagnitudeLimitsUseTheAbsoluteWork) {
  Limits l;
  l.work_magnitude_max_J = 3.0;
  const Check c = only(judge_limits(l, result(-4.0, 0.0, 1.0)));
  EXPECT_EQ(c.value, 4.0);
  EXPECT_FALSE(c.pass);
}

TEST(JudgeLimits, PeakForceLimitUsesTheMagnitudeOfTheSignedPeak) {
  Limits l;
  l.peak_force_max_N = 11.0;
  const Check c = only(judge_limits(l, result(1.0, 0.0, 1.0)));
  EXPECT_EQ(c.value, 12.0);
  EXPECT_FALSE(c.pass);
}

TEST(JudgeLimits, WorkOfANamedFieldIsCheckedWhenAsked) {
  Limits l;
  l.work_of = "spring";
  l.work_min_J = 2.0;
  const Check c = only(judge_limits(l, result(10.0, 0.0, 1.0)));
  EXPECT_EQ(c.value, 2.5);
  EXPECT_TRUE(c.pass);
}

TEST(JudgeLimits, WorkOfAnUnknownFieldIsABadOption) {
  Limits l;
  l.work_of = "brake";
  l.work_min_J = 2.0;
  try {
    judge_limits(l, result(10.0, 0.0, 1.0));
    FAIL() << "accepted";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadOption);
  }
}

TEST(JudgeLimits, CirculationLimitOnAnOpenPathIsABadOption) {
  Limits l;
  l.circulation_max_J = 1e-6;
  try {
    judge_limits(l, result(0.0, 0.0, 1.0, false));
    FAIL() << "accepted";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadOption);
  }
  EXPECT_TRUE(only(judge_limits(l, result(1e-9, 1e-12, 1.0, true))).pass);
}

TEST(JudgeLimits, LengthLimitsBracketThePathLength) {
  Limits l;
  l.length_min_m = 0.9;
  l.length_max_m = 1.1;
  const auto checks = judge_limits(l, result(0.0, 0.0, 1.0));
  ASSERT_EQ(checks.size(), 2u);
  EXPECT_TRUE(checks[0].pass && checks[1].pass);
  EXPECT_EQ(verdict_of(checks), Verdict::Pass);
  EXPECT_EQ(verdict_of(judge_limits(l, result(0.0, 0.0, 1.2))), Verdict::Fail);
}

TEST(CaseResultJson, RoundTripKeepsEveryField) {
  CaseResult r;
  r.index = 7;
  r.name = "drawer";
  r.inputs_sha256 = std::string(64, 'a');
  r.model = "../drawer.stp";
  r.selector = "edges:1,2";
  r.verdict = Verdict::Fail;
  CaseValues v;
  v.work_J = -4.767483183;
  v.work_error_J = 1e-11;
  v.length_m = 0.5;
  v.peak_force_N = -28.8;
  v.peak_edge = 2;
  v.closed = false;
  v.evaluations = 1234;
  v.field_work_J = {{"friction", -4.4}, {"detent", -0.35}};
  r.values = v;
  r.checks = {{"work_J", "min", -4.0, -4.767483183, 1e-11, false}};
  r.elapsed_s = 0.25;
  const CaseResult back = case_result_from_json(nlohmann::json::parse(to_json(r).dump()));
  EXPECT_EQ(to_json(back), to_json(r));
  EXPECT_EQ(back.values->work_J, v.work_J);  // doubles survive the text form bit for bit
}

TEST(CaseResultJson, ErrorRecordCarriesKindAndMessage) {
  CaseResult r;
  r.name = "x";
  r.verdict = Verdict::Error;
  r.error_kind = "gap_too_large";
  r.error_message = "edges 1 and 2 are 3 mm apart";
  const nlohmann::json j = to_json(r);
  EXPECT_EQ(j["error"]["kind"], "gap_too_large");
  EXPECT_TRUE(j["values"].is_null());
  EXPECT_EQ(case_result_from_json(j).error_message, r.error_message);
}

}  // namespace
}  // namespace ergpath::batch
