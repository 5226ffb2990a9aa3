/**
 * Every rule, in the order they run. Kept apart from registry.ts so the rules may import the
 * registry's types without a cycle. `reversed-device` comes from recognition, and
 * `default-model` and `assumed-condition` from the equivalent circuit; they are not rules here.
 */
import type { Rule } from './registry';
import { bypassedDeviceRule } from './bypassed-device';
import { capLifeRule } from './cap-life';
import { capRippleRule } from './cap-ripple';
import { capVoltageRule } from './cap-voltage';
import { controllerOvervoltageRule } from './controller-overvoltage';
import { controllerUndervoltageRule } from './controller-undervoltage';
import { currentRatingRule } from './current-rating';
import { duplicateNameRule } from './duplicate-name';
import { harmonicLimitRule } from './harmonic-limit';
import { hazardousVoltageRule } from './hazardous-voltage';
import { implausibleValueRule } from './implausible-value';
import { junctionTempRule } from './junction-temp';
import { missingRatingRule } from './missing-rating';
import { mixedBridgeRule } from './mixed-bridge';
import { mosfetVdsRule } from './mosfet-vds';
import { pivMarginRule } from './piv-margin';
import { shortedSourceRule } from './shorted-source';
import { surgeRatingRule } from './surge-rating';
import { thermalRunawayRule } from './thermal-runaway';
import { unbalancedStringRule } from './unbalanced-string';

export const ALL_RULES: readonly Rule[] = [
  pivMarginRule, currentRatingRule, surgeRatingRule, junctionTempRule, thermalRunawayRule,
  mosfetVdsRule, capVoltageRule, capRippleRule, capLifeRule, unbalancedStringRule, controllerUndervoltageRule, controllerOvervoltageRule, harmonicLimitRule,
  missingRatingRule, mixedBridgeRule, hazardousVoltageRule, implausibleValueRule, shortedSourceRule,
  bypassedDeviceRule, duplicateNameRule,
];
