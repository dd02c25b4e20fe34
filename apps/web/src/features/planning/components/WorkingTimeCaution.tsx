import { MessageBar, MessageBarBody, MessageBarTitle } from '@fluentui/react-components';
import { WORKING_TIME_CAUTION } from '@rotaplex/contracts';

/** The caution every working-time rule carries (PRODUCT.md, "Cautions shown in the product"). */
export function WorkingTimeCaution() {
  return (
    <MessageBar intent="warning" layout="multiline" aria-label="Working-time caution">
      <MessageBarBody>
        <MessageBarTitle>Not legal advice</MessageBarTitle>
        {WORKING_TIME_CAUTION}
      </MessageBarBody>
    </MessageBar>
  );
}
