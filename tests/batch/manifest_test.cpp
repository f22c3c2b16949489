#include <gtest/gtest.h>

#include <string>

#include "plugin/batch/manifest.h"
#include "plugin/core/error.h"
#include "text_models.h"

namespace ergpath::batch {
namespace {

const char* kMinimal = R"(
[[case]]
name = "a"
model = "m.txt"
[case.forces]
push = "1, 0, 0"
[case.limits]
work_max_J = 1.0
)";

// Runs parse_manifest_text and returns the BadManifest message; fails the test for any other outcome.
std::string manifest_error(const std::string& text) {
  try {
    parse_manifest_text(text, "demo.toml", "");
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadManifest) << e.what();
    return e.what();
  }
  ADD_FAILURE() << "manifest was accepted";
  return "";
}

TEST(Manifest, MinimalCaseTakesTheDocumentedDefaults) {
  const Manifest m = parse_manifest_text(kMinimal, "demo.toml", "dir");
  ASSERT_EQ(m.cases.size(), 1u);
  const CaseSpec& c = m.cases[0];
  EXPECT_EQ(c.name, "a");
  EXPECT_EQ(c.model_file, "dir/m.txt");
  EXPECT_EQ(c.selector, "all");
  EXPECT_FALSE(c.reverse);
  EXPECT_EQ(c.tolerance, 1e-10);
  EXPECT_EQ(c.gap_tolerance_mm, 1e-3);
  EXPECT_EQ(*c.limits.work_max_J, 1.0);
  EXPECT_EQ(c.line, 2);
}

TEST(Manifest, UnknownCaseKeyIsAnErrorNamingItsLine) {
  const std::string text = std::string(kMinimal) + "[[case]]\nname = \"b\"\nmodel = \"m.txt\"\nmodle = 3\n";
  const std::string msg = manifest_error(text);
  EXPECT_NE(msg.find("demo.toml:12:"), std::string::npos) << msg;
  EXPECT_NE(msg.find("unknown key 'modle'"), std::string::npos) << msg;
}

TEST(Manifest, UnknownTopLevelKeyIsAnError) {
  const std::string msg = manifest_error(std::string("verbose = true\n") + kMinimal);
  EXPECT_NE(msg.find("demo.toml:1:"), std::string::npos) << msg;
}

TEST(Manifest, UnknownLimitIsAnErrorNamingItsLine) {
  const std::string msg = manifest_error(std::string(kMinimal) + "torque_max_Nm = 3\n");
  EXPECT_NE(msg.find("demo.toml:9:"), std::string::npos) << msg;
  EXPECT_NE(msg.find("torque_max_Nm"), std::string::npos) << msg;
}

TEST(Manifest, WrongTypeIsAnErrorNamingItsLine) {
  std::string text = kMinimal;
  text.replace(text.find("work_max_J = 1.0"), 16, "work_max_J = \"1\"");
  const std::string msg = manifest_error(text);
  EXPECT_NE(msg.find("demo.toml:8:"), std::string::npos) << msg;
  EXPECT_NE(msg.find("must be a finite number"), std::string::npos) << msg;
}

TEST(Manifest, ConstantOfWrongTypeIsAnErrorNamingItsLine) {
  const std::string msg = manifest_error(std::string(kMinimal) + "[case.constants]\nm = \"heavy\"\n");
  EXPECT_NE(msg.find("demo.toml:10:"), std::string::npos) << msg;
}

TEST(Manifest, TomlSyntaxErrorNamesItsLine) {
  const std::string msg = manifest_error(std::string(kMinimal) + "work_min_J = = 2\n");
  EXPECT_NE(msg.find("demo.toml:9:"), std::string::npos) << msg;
}

TEST(Manifest, CaseWithoutLimitsIsRejected) {
  const std::string msg = manifest_error("[[case]]\nname = \"a\"\nmodel = \"m\"\n");
  EXPECT_NE(msg.find("no limit"), std::string::npos) << msg;
}

TEST(Manifest, DuplicateCaseNamesAreRejected) {
  const std::string msg = manifest_error(std::string(kMinimal) + kMinimal);
  EXPECT_NE(msg.find("used twice"), std::string::npos) << msg;
}

TEST(Manifest, CaseWithoutModelIsRejected) {
  const std::string msg = manifest_error("[[case]]\nname = \"a\"\n[case.limits]\nwork_max_J = 1\n");
  EXPECT_NE(msg.find("no 'model'"), std::string::npos) << msg;
}

TEST(Manifest, MinimumAboveMaximumIsRejected) {
  const std::string msg = manifest_error(std::string(kMinimal) + "work_min_J = 2.0\n");
  EXPECT_NE(msg.find("minimum exceeds maximum"), std::string::npos) << msg;
}

TEST(Manifest, EmptyManifestIsRejected) { manifest_error("title = \"nothing\"\n"); }

TEST(Manifest, MissingFileIsABadManifest) {
  try {
    read_manifest("no/such/manifest.toml");
    FAIL() << "accepted";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadManifest);
    EXPECT_NE(std::string(e.what()).find("no/such/manifest.toml"), std::string::npos);
  }
}

TEST(Manifest, DefaultsApplyToEveryCaseAndCasesOverrideThem) {
  const Manifest m = parse_manifest_text(R"(
[defaults]
model = "shared.txt"
tolerance = 1e-8
path = "edge:1"
[defaults.limits]
work_max_J = 10.0
[defaults.constants]
k = 2.0

[[case]]
name = "inherits"

[[case]]
name = "overrides"
tolerance = 1e-6
[case.limits]
work_max_J = 20.0
length_max_m = 3.0
[case.constants]
k = 5.0
[case.forces]
f = "k, 0, 0"
)",
                                         "d.toml", "");
  ASSERT_EQ(m.cases.size(), 2u);
  EXPECT_EQ(m.cases[0].model_file, "shared.txt");
  EXPECT_EQ(m.cases[0].selector, "edge:1");
  EXPECT_EQ(m.cases[0].tolerance, 1e-8);
  EXPECT_EQ(*m.cases[0].limits.work_max_J, 10.0);
  EXPECT_EQ(m.cases[1].tolerance, 1e-6);
  EXPECT_EQ(*m.cases[1].limits.work_max_J, 20.0);
  EXPECT_EQ(*m.cases[1].limits.length_max_m, 3.0);
  const FieldSpec f = resolve_field(m.cases[1]);
  ASSERT_EQ(f.constants.size(), 1u);
  EXPECT_EQ(f.constants[0].second, 5.0);
  try {
    resolve_field(m.cases[0]);
    FAIL() << "a case without forces resolved";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadFormula);
  }
}

TEST(Manifest, InlineFieldKeysAreLaidOverTheFieldFile) {
  const std::string dir = testing::fresh_dir("ergpath_manifest_");
  testing::write_file(
      dir + "/loads.toml",
      "length_unit = \"mm\"\n[constants]\nm = 1.0\nk = 3.0\n[forces]\nw = \"0, 0, -m*g_n\"\n");
  testing::write_file(dir + "/batch.toml", R"(
[defaults]
length_unit = "m"
[[case]]
name = "c"
model = "m.txt"
field_file = "loads.toml"
[case.constants]
m = 4.0
[case.forces]
s = "-k*x, 0, 0"
[case.limits]
work_max_J = 1
)");
  const Manifest m = read_manifest(dir + "/batch.toml");
  EXPECT_EQ(m.cases[0].field_file, dir + "/loads.toml");
  const FieldSpec f = resolve_field(m.cases[0]);
  EXPECT_EQ(f.length_unit_m, 1.0);  // [defaults] length_unit over the file's "mm"
  ASSERT_EQ(f.constants.size(), 2u);
  auto constant = [&](const std::string& name) {
    for (const auto& [n, v] : f.constants) {
      if (n == name) return v;
    }
    ADD_FAILURE() << "no constant " << name;
    return 0.0;
  };
  EXPECT_EQ(constant("m"), 4.0);  // the case's value replaces the file's
  EXPECT_EQ(constant("k"), 3.0);
  ASSERT_EQ(f.forces.size(), 2u);
  EXPECT_EQ(f.forces[1].name, "s");
}

TEST(Manifest, BrokenFieldFileSurfacesWhenTheCaseIsResolvedNotWhenTheManifestIsRead) {
  const Manifest m = parse_manifest_text(std::string(kMinimal) +
                                             "[[case]]\nname = \"b\"\nmodel = \"m\"\n"
                                             "field_file = \"missing.toml\"\n"
                                             "[case.limits]\nwork_max_J = 1\n",
                                         "demo.toml", "");
  try {
    resolve_field(m.cases[1]);
    FAIL() << "resolved";
  } catch (const Error& e) {
    EXPECT_EQ(e.kind(), ErrorKind::BadManifest);
    EXPECT_NE(std::string(e.what()).find("missing.toml"), std::string::npos);
  }
}

TEST(Manifest, DigestChangesWithTheManifestText) {
  const Manifest a = parse_manifest_text(kMinimal, "a.toml", "");
  const Manifest b = parse_manifest_text(std::string(kMinimal) + "# a comment\n", "a.toml", "");
  EXPECT_EQ(a.sha256.size(), 64u);
  EXPECT_NE(a.sha256, b.sha256);
}

}  // namespace
}  // namespace ergpath::batch
