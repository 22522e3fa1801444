using QaService.Core.Statistics;

namespace QaService.Core.Reporting;

/// <summary>The counted pairs split by one fix attribute, each value's figures and verdict, and whether the groups differ.</summary>
/// <param name="Attribute"><c>featureClass</c>, <c>crew</c> or <c>receiver</c>.</param>
/// <param name="Groups">One entry per value, in order of first appearance among the counted pairs.</param>
/// <param name="WithoutValue">Counted pairs whose fix gives no value of this attribute (in no group).</param>
/// <param name="Tests">Tests that the groups share spread and mean; empty when fewer than two groups can be compared.</param>
public sealed record AttributeGroups(string Attribute, IReadOnlyList<AttributeGroup> Groups, int WithoutValue, IReadOnlyList<GroupDifference> Tests);

/// <summary>One value's pairs, with the same figures, definitions and code as the report's top-level blocks.</summary>
/// <param name="Value">The attribute value.</param>
/// <param name="N">Counted pairs with this value.</param>
/// <param name="Horizontal">Horizontal figures of these pairs, metres.</param>
/// <param name="Vertical">Vertical figures of the pairs with heights; null without.</param>
/// <param name="Verdict">pass / fail / inconclusive against <paramref name="Spec"/>, by the top-level rule; inconclusive below the standard's minimum points.</param>
/// <param name="Spec">The required accuracy judged and how each figure fared; null when no spec applies.</param>
/// <param name="SpecSource">Where the spec came from: <c>spec.featureClasses.&lt;value&gt;</c>, <c>spec</c> (top level) or <c>none</c>.</param>
public sealed record AttributeGroup(string Value, int N, HorizontalAccuracy Horizontal, VerticalAccuracy? Vertical, Verdict Verdict, SpecSummary? Spec,
    string SpecSource);

/// <summary>A test that the groups of one attribute share a parameter of one residual quantity.</summary>
/// <param name="Hypothesis"><c>equal-spread</c> or <c>equal-means</c>.</param>
/// <param name="Quantity"><c>dH</c>, <c>dE</c>, <c>dN</c> or <c>dU</c>.</param>
/// <param name="Method">The test and its source.</param>
/// <param name="Groups">Groups that entered the test.</param>
/// <param name="Statistic">F statistic.</param>
/// <param name="DegreesOfFreedom1">ν₁.</param>
/// <param name="DegreesOfFreedom2">ν₂.</param>
/// <param name="PValue">Chance of so large a statistic if the groups share the parameter; below 0.05 the groups differ at the 5 % level.</param>
public sealed record GroupDifference(string Hypothesis, string Quantity, string Method, int Groups, double Statistic, double DegreesOfFreedom1,
    double DegreesOfFreedom2, double PValue);
